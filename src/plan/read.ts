/**
 * Reading a plan file: YAML with positions, the format version first (a plan from a newer tandem
 * gets one clear message rather than a page of schema errors), then the committed JSON Schema,
 * then the checks the schema cannot express (src/plan/semantic.ts). Every problem carries the
 * file, line and column; all of a file's problems are reported together.
 */
import { readFileSync } from 'node:fs';
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { InputError } from '../errors.js';
import { schemasDir } from '../paths.js';
import type { Problem } from '../problems.js';
import { VERSION } from '../version.js';
import { loadYaml, positionOf, type LoadedYaml } from '../yaml/load.js';
import { compileSchema, validateLoaded } from '../yaml/validate.js';
import { semanticFindings } from './semantic.js';
import { PLAN_FORMAT, type Plan } from './types.js';
import { normalizePlan, PLAN_SCHEMA_FILE } from './write.js';

let schema: object | undefined;

/** The committed schema, schemas/plan-v1.schema.json (the same file editors use). */
export function planSchema(): object {
  schema ??= JSON.parse(readFileSync(join(schemasDir(), PLAN_SCHEMA_FILE), 'utf8')) as object;
  return schema;
}

export interface PlanCheck {
  /** The plan when there are no problems, else null. */
  plan: Plan | null;
  problems: Problem[];
}

/** Every problem of a plan's text, with positions; the plan itself when there are none. */
export function checkPlanText(text: string, file: string): PlanCheck {
  const loaded = loadYaml(text, file);
  if (loaded.problems.length) return { plan: null, problems: loaded.problems };
  const v = loaded.value;
  const at = (path: (string | number)[], key = false): { line: number; col: number } => positionOf(loaded, path, { key });
  if (v === null || v === undefined) {
    return { plan: null, problems: [{ code: 'missing-key', file, line: 1, col: 1, message: 'the plan file is empty', hint: `a plan starts with 'format: ${PLAN_FORMAT}'` }] };
  }
  if (typeof v !== 'object' || Array.isArray(v)) {
    return { plan: null, problems: [{ code: 'wrong-type', file, ...at([]), message: `a plan is a mapping of keys (format, title, study, ...), not ${Array.isArray(v) ? 'a list' : 'a single value'}` }] };
  }
  const version = formatProblem((v as Record<string, unknown>).format, loaded);
  if (version) return { plan: null, problems: [version] };

  const schemaProblems = validateLoaded(loaded, planSchema());
  if (schemaProblems.length) return { plan: null, problems: sortProblems(schemaProblems) };

  const plan = v as Plan;
  const problems = semanticFindings(plan).map((f): Problem => ({ code: f.code, file, ...at(f.path, f.code === 'unknown-key'), message: f.message, ...(f.hint ? { hint: f.hint } : {}) }));
  return problems.length ? { plan: null, problems: sortProblems(problems) } : { plan, problems: [] };
}

/** The format line: ours in version 1, or one clear message (newer version, or not a plan). */
function formatProblem(format: unknown, loaded: LoadedYaml): Problem | null {
  if (format === undefined || format === PLAN_FORMAT) return null; // a missing key is the schema's to report
  const pos = positionOf(loaded, ['format']);
  const base = { code: 'format-version' as const, file: loaded.file, line: pos.line, col: pos.col };
  const m = typeof format === 'string' ? /^tandem-plan\/(\d+)$/.exec(format.trim()) : null;
  if (m && Number(m[1]) > 1) {
    return { ...base, message: `this plan is in format ${format}, written by a newer tandem; tandem ${VERSION} reads ${PLAN_FORMAT}`, hint: 'upgrade tandem to read it' };
  }
  if (m) return { ...base, message: `unknown plan format version '${format}'`, hint: `expected ${PLAN_FORMAT}` };
  return { ...base, message: `not a tandem plan: format is ${JSON.stringify(format)}`, hint: `a plan file's format line is 'format: ${PLAN_FORMAT}'` };
}

function sortProblems(ps: Problem[]): Problem[] {
  return [...ps].sort((a, b) => (a.line ?? 0) - (b.line ?? 0) || (a.col ?? 0) - (b.col ?? 0));
}

/** The plan in `text`, or InputError with every problem positioned. */
export function parsePlanText(text: string, file: string): Plan {
  const { plan, problems } = checkPlanText(text, file);
  if (!plan) throw new InputError(`${file} is not a valid ${PLAN_FORMAT} plan (${count(problems.length)})`, problems);
  return plan;
}

/** The plan's file text; a missing or unreadable file is an InputError that says which. */
export async function readPlanSource(path: string): Promise<string> {
  try {
    return await readFile(path, 'utf8');
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    const why = code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? 'it is a folder' : code === 'EACCES' ? 'permission denied' : (err as Error).message;
    throw new InputError(`cannot read plan ${path}: ${why}`);
  }
}

/** Reads and checks a plan file; used by analyze, size and audit. */
export async function readPlan(path: string): Promise<Plan> {
  return parsePlanText(await readPlanSource(path), path);
}

/**
 * Problems of a plan built in memory (before it is written): the schema and the semantic checks,
 * as messages naming the path (there is no text to point into).
 */
export function checkPlanObject(plan: Plan): string[] {
  const value = JSON.parse(JSON.stringify(normalizePlan(plan))) as unknown;
  const validate = compileSchema(planSchema());
  if (!validate(value)) {
    return (validate.errors ?? [])
      .filter((e) => e.keyword !== 'if')
      .map((e) => `${e.instancePath.slice(1).replace(/\//g, '.') || '(top level)'} ${e.message ?? 'is invalid'}${e.keyword === 'additionalProperties' ? `: '${String((e.params as Record<string, unknown>).additionalProperty)}'` : ''}`);
  }
  return semanticFindings(plan).map((f) => `${f.path.join('.')}: ${f.message}${f.hint ? ` (${f.hint})` : ''}`);
}

function count(n: number): string {
  return `${n} problem${n === 1 ? '' : 's'}`;
}
