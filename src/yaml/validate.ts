/**
 * JSON Schema validation of a loaded YAML file, with each error placed at its line and column.
 * The same committed schema files serve editors (through the modeline) and this check.
 */
import { Ajv, type ErrorObject, type ValidateFunction } from 'ajv';
import type { Problem } from '../problems.js';
import { positionOf, type LoadedYaml } from './load.js';

const cache = new WeakMap<object, ValidateFunction>();

export function compileSchema(schema: object): ValidateFunction {
  const known = cache.get(schema);
  if (known) return known;
  const compiled = new Ajv({ allErrors: true, strict: false }).compile(schema);
  cache.set(schema, compiled);
  return compiled;
}

export function validateLoaded(loaded: LoadedYaml, schema: object): Problem[] {
  if (loaded.problems.length) return loaded.problems;
  const validate = compileSchema(schema);
  if (validate(loaded.value)) return [];
  // An if/then schema reports a summary error ('must match "then" schema') beside the specific
  // one that says what is wrong; only the specific one helps the reader.
  const errors = (validate.errors ?? []).filter((e) => e.keyword !== 'if');
  return dedupe(errors.map((e) => toProblem(e, loaded)));
}

function toProblem(e: ErrorObject, loaded: LoadedYaml): Problem {
  const path = e.instancePath.split('/').slice(1).map((s) => s.replace(/~1/g, '/').replace(/~0/g, '~'));
  const where = path.length ? path.join('.') : '(top level)';
  let message = `${where} ${e.message ?? 'is invalid'}`;
  let hint: string | undefined;
  let keyPath = path;
  let atKey = false;
  const params = e.params as Record<string, unknown>;
  if (e.keyword === 'additionalProperties') {
    const extra = String(params.additionalProperty);
    keyPath = [...path, extra];
    atKey = true;
    message = `unknown key '${extra}' in ${where}`;
  } else if (e.keyword === 'enum') {
    hint = `allowed: ${(params.allowedValues as unknown[]).map((v) => JSON.stringify(v)).join(', ')}`;
  } else if (e.keyword === 'required') {
    message = `${where} is missing the required key '${String(params.missingProperty)}'`;
  } else if (e.keyword === 'const') {
    hint = `expected ${JSON.stringify(params.allowedValue)}`;
  }
  const pos = positionOf(loaded, keyPath, { key: atKey });
  const code = e.keyword === 'additionalProperties' ? 'unknown-key' : e.keyword === 'required' ? 'missing-key' : e.keyword === 'enum' ? 'unknown-value' : e.keyword === 'type' ? 'wrong-type' : 'schema';
  return { code, file: loaded.file, line: pos.line, col: pos.col, message, hint };
}

function dedupe(ps: Problem[]): Problem[] {
  const seen = new Set<string>();
  return ps.filter((p) => {
    const k = `${p.line}:${p.col}:${p.message}`;
    if (seen.has(k)) return false;
    seen.add(k);
    return true;
  });
}
