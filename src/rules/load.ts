/**
 * Loading the rule base: every *.yaml / *.yml file of a directory is parsed safely (positions,
 * bounded aliases, no prototype keys), checked against schemas/rules.schema.json, and the
 * sections of all files are merged and cross-checked. All problems of all files are collected
 * and reported together, each with file, line and column.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { InputError } from '../errors.js';
import type { Problem } from '../problems.js';
import { rulesDir, schemasDir } from '../paths.js';
import { loadYaml } from '../yaml/load.js';
import { validateLoaded } from '../yaml/validate.js';
import type { RuleBase } from '../engine/model.js';
import { buildRuleBase, type ParsedFile } from './build.js';

let schema: object | undefined;
function rulesSchema(): object {
  schema ??= JSON.parse(readFileSync(join(schemasDir(), 'rules.schema.json'), 'utf8')) as object;
  return schema;
}

export interface RuleBaseRead {
  rb?: RuleBase;
  problems: Problem[];
  /** File name -> source text, so problems can be shown with the offending line. */
  sources: Map<string, string>;
  files: string[];
}

/** The rule files of a directory, sorted; InputError when the directory cannot be read. */
export function ruleFiles(dir: string): string[] {
  let names: string[];
  try {
    names = readdirSync(dir);
  } catch (err) {
    const why = (err as NodeJS.ErrnoException).code === 'ENOENT' ? 'does not exist' : (err as NodeJS.ErrnoException).code === 'ENOTDIR' ? 'is not a directory' : 'cannot be read';
    throw new InputError(`the rules directory '${dir}' ${why}`);
  }
  const files = names.filter((n) => /\.ya?ml$/i.test(n)).sort();
  if (files.length === 0) throw new InputError(`the rules directory '${dir}' holds no .yaml files`);
  return files.map((n) => join(dir, n));
}

/** Reads and checks every rule file; returns the problems instead of throwing on them. */
export function readRuleBase(dir: string = rulesDir()): RuleBaseRead {
  const paths = ruleFiles(dir);
  const problems: Problem[] = [];
  const sources = new Map<string, string>();
  const parsed: ParsedFile[] = [];
  const shown = (p: string): string => {
    const r = relative(process.cwd(), p);
    return r && !r.startsWith('..') ? r : p;
  };
  for (const path of paths) {
    const file = shown(path);
    let text: string;
    try {
      text = readFileSync(path, 'utf8');
    } catch {
      throw new InputError(`the rule file '${file}' cannot be read`);
    }
    sources.set(file, text);
    const loaded = loadYaml(text, file);
    if (loaded.problems.length) {
      problems.push(...loaded.problems);
      continue;
    }
    if (loaded.value === null || loaded.value === undefined) continue; // an empty file adds nothing
    const fileProblems = validateLoaded(loaded, rulesSchema());
    if (fileProblems.length) {
      problems.push(...fileProblems);
      continue;
    }
    parsed.push({ loaded, value: loaded.value as Record<string, unknown> });
  }
  const files = paths.map(shown);
  // Cross-file checks need every file; build only when each file is sound on its own.
  if (problems.length) return { problems, sources, files };
  const built = buildRuleBase(dir, parsed);
  return { rb: built.problems.length ? undefined : built.rb, problems: built.problems, sources, files };
}

/** The rule base, or InputError listing every problem with file, line and column. */
export function loadRuleBase(dir: string = rulesDir()): RuleBase {
  const read = readRuleBase(dir);
  if (!read.rb) {
    const n = read.problems.length;
    throw new InputError(`the rule base in '${dir}' has ${n} problem${n === 1 ? '' : 's'}`, read.problems);
  }
  return read.rb;
}
