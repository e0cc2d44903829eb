/**
 * Reading an audit record from disk: the YAML file, the answers file or plan it refers to, and
 * the classification of the study facts by the rule base. This is the audit's only file I/O
 * besides the data (src/audit/on-data.ts); the checks themselves are pure.
 *
 * Bad input (unreadable file, schema errors, unknown question ids or answer values) is an
 * InputError listing every problem with its line and column. Answers that are merely incomplete
 * are not an error: a reviewer may not know every fact; the design checks are then skipped and
 * the review says why.
 */
import { readFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { classify, loadRuleBase, answerProblem, type RuleBase } from '../engine/index.js';
import type { Recommendation } from '../engine/types.js';
import { InputError } from '../errors.js';
import { loadAnswersFile } from '../interview/answers-file.js';
import { schemasDir } from '../paths.js';
import { readPlan } from '../plan/read.js';
import type { DataMapping } from '../plan/types.js';
import type { Problem } from '../problems.js';
import { loadYaml, positionOf, type LoadedYaml } from '../yaml/load.js';
import { parseRecord, type ParsedRecord } from './record.js';

export const AUDIT_SCHEMA_FILE = 'audit-v1.schema.json';

let schemaCache: object | undefined;
function auditSchema(): object {
  if (!schemaCache) schemaCache = JSON.parse(readFileSync(join(schemasDir(), AUDIT_SCHEMA_FILE), 'utf8')) as object;
  return schemaCache;
}

export interface ReadRecord extends ParsedRecord {
  recommendation: Recommendation | null;
  recommendationNote?: string;
}

function readText(path: string, shown: string, what: string): string {
  try {
    return readFileSync(path, 'utf8');
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    const why = code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? 'it is a folder' : code === 'EACCES' ? 'permission denied' : String(code ?? err);
    throw new InputError(`cannot read ${what} ${shown}: ${why}`);
  }
}

/** Reads, validates and resolves an audit record; `shown` is the path as the user wrote it. */
export async function readAuditRecord(path: string, shown = path, rulesDir?: string): Promise<ReadRecord> {
  const loaded = loadYaml(readText(path, shown, 'audit record'), shown);
  const parsed = parseRecord(loaded, auditSchema());
  if (parsed.problems.length) throw invalid(shown, parsed.problems);
  // The rule base is needed only to check and classify answers.
  let rbCache: RuleBase | undefined;
  const rules = (): RuleBase => (rbCache ??= loadRuleBase(rulesDir));
  const base = dirname(path);
  const out: ReadRecord = { ...parsed, recommendation: null };
  const { record, refs } = parsed;
  if (refs.answersFile) {
    const a = loadAnswersFile(resolve(base, refs.answersFile), rules());
    record.answers = a.answers;
    record.answersFrom = refs.answersFile;
    if (!record.mapping && a.data && typeof a.data.layout === 'string') record.mapping = a.data as unknown as DataMapping;
  } else if (refs.planFile) {
    const plan = await readPlan(resolve(base, refs.planFile));
    record.answers = plan.answers;
    record.answersFrom = refs.planFile;
    if (!record.mapping) {
      const { missing, delimiter, ...mapping } = plan.data;
      record.mapping = mapping as DataMapping;
      if (missing && !record.missing) record.missing = missing;
      if (delimiter && !record.delimiter) record.delimiter = delimiter;
    }
  } else if (record.answers) {
    const problems = checkInlineAnswers(loaded, rules(), record.answers);
    if (problems.length) throw invalid(shown, problems);
  }
  if (!record.answers) {
    out.recommendationNote = record.statedDesign ? 'the design was stated by the reviewer (no answers to classify)' : 'the record holds no study facts';
    return out;
  }
  try {
    out.recommendation = classify(rules(), record.answers);
  } catch (err) {
    if (!(err instanceof InputError)) throw err;
    const missing = err.problems.filter((p) => p.code === 'missing-key');
    if (missing.length === 0 || missing.length !== err.problems.length) throw new InputError(`${shown}: the study answers do not fit the interview's questions: ${err.message}`, err.problems);
    out.recommendationNote = `the study answers are incomplete (${err.message}), so the design was ${record.statedDesign ? 'taken as the reviewer stated it' : 'not classified'}`;
  }
  return out;
}

/** Unknown question ids and values that do not fit their question, each at its line. */
function checkInlineAnswers(loaded: LoadedYaml, rb: RuleBase, answers: Record<string, unknown>): Problem[] {
  const problems: Problem[] = [];
  const byId = new Map(rb.questions.map((q) => [q.id, q]));
  for (const [id, value] of Object.entries(answers)) {
    const q = byId.get(id);
    if (!q) {
      const pos = positionOf(loaded, ['study', 'answers', id], { key: true });
      problems.push({ code: 'unknown-key', file: loaded.file, ...pos, message: `unknown question id '${id}' in study.answers`, hint: `known ids: ${[...byId.keys()].join(', ')}` });
      continue;
    }
    const why = answerProblem(q, value as never);
    if (why && !(value === '' && q.optional)) {
      const pos = positionOf(loaded, ['study', 'answers', id]);
      problems.push({ code: 'unknown-value', file: loaded.file, ...pos, message: why });
    }
  }
  return problems;
}

function invalid(file: string, problems: Problem[]): InputError {
  return new InputError(`${file} is not a valid audit record (${problems.length} problem${problems.length === 1 ? '' : 's'})`, problems);
}
