/**
 * The answers file, format `tandem-answers/1` (YAML; editors validate it through the modeline
 * and schemas/answers-v1.schema.json). It lets `tandem advise --answers FILE` run without a
 * terminal and lets a study team keep the answers beside the data. Example (invented):
 *
 *   # yaml-language-server: $schema=../schemas/answers-v1.schema.json
 *   format: tandem-answers/1
 *   title: Kiln glaze trial, spring firing
 *   answers:
 *     # What is each measurement taken on?
 *     unit: test tile
 *     first_label: cone 6 glaze
 *   data:
 *     layout: wide
 *     first: cone6_gloss
 *     second: cone5_gloss
 *
 * Loading checks every answer against its question (known id, listed choice, number in range,
 * whole number where asked) and reports all problems together, each with line and column.
 * The `data` block is passed through unchecked; the plan module validates it.
 */
import { readFileSync } from 'node:fs';
import { dirname, isAbsolute, join, relative, resolve, sep } from 'node:path';
import { pathToFileURL } from 'node:url';
import { Document, isScalar, type Pair, type Scalar, type YAMLMap } from 'yaml';
import { questionAsShown } from '../engine/templates.js';
import type { Answers, Question, RuleBaseView } from '../engine/types.js';
import { InputError } from '../errors.js';
import { writeFileAtomic } from '../fs/atomic.js';
import { schemasDir } from '../paths.js';
import type { Problem } from '../problems.js';
import { VERSION } from '../version.js';
import { loadYaml, positionOf } from '../yaml/load.js';
import { checkValue } from './check-value.js';

export const ANSWERS_FORMAT = 'tandem-answers/1';
export const ANSWERS_SCHEMA_FILE = 'answers-v1.schema.json';
const TOP_KEYS = ['format', 'title', 'answers', 'data'];

export interface AnswersFile {
  answers: Answers;
  title?: string;
  /** The data mapping as written (see DataMapping in src/plan/types.ts); not validated here. */
  data?: Record<string, unknown>;
  file: string;
}

export function loadAnswersFile(path: string, rb: RuleBaseView): AnswersFile {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    const why = code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? 'it is a folder' : err instanceof Error ? err.message : String(err);
    throw new InputError(`cannot read the answers file ${path}: ${why}`);
  }
  return parseAnswersText(text, path, rb);
}

const isMapping = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

export function parseAnswersText(text: string, file: string, rb: RuleBaseView): AnswersFile {
  const loaded = loadYaml(text, file);
  const fail = (ps: Problem[]): never => {
    throw new InputError(`${file}: ${ps.length === 1 ? 'a problem' : `${ps.length} problems`} in the answers file; nothing was read`, ps);
  };
  if (loaded.problems.length) fail(loaded.problems);
  const v = loaded.value;
  const problems: Problem[] = [];
  const at = (path: (string | number)[], key = false): { file: string; line: number; col: number } => ({ file, ...positionOf(loaded, path, { key }) });
  if (!isMapping(v)) {
    fail([{ code: 'wrong-type', ...at([]), message: 'an answers file is a mapping with the keys format and answers', hint: `start with the line "format: ${ANSWERS_FORMAT}"` }]);
  }
  const top = v as Record<string, unknown>;
  for (const k of Object.keys(top)) {
    if (!TOP_KEYS.includes(k)) problems.push({ code: 'unknown-key', ...at([k], true), message: `unknown key '${k}'`, hint: `allowed: ${TOP_KEYS.join(', ')}` });
  }
  if (!('format' in top)) {
    problems.push({ code: 'missing-key', ...at([]), message: 'the format line is missing', hint: `add "format: ${ANSWERS_FORMAT}"` });
  } else if (top.format !== ANSWERS_FORMAT) {
    problems.push({ code: 'format-version', ...at(['format']), message: `format is ${JSON.stringify(top.format)}; this tandem reads ${ANSWERS_FORMAT}`, hint: `expected "${ANSWERS_FORMAT}"` });
  }
  let title: string | undefined;
  if ('title' in top && top.title !== null) {
    if (typeof top.title === 'string' || typeof top.title === 'number') title = String(top.title);
    else problems.push({ code: 'wrong-type', ...at(['title']), message: 'title must be text' });
  }
  let data: Record<string, unknown> | undefined;
  if ('data' in top && top.data !== null) {
    if (isMapping(top.data)) data = top.data;
    else problems.push({ code: 'wrong-type', ...at(['data']), message: 'data must be a mapping (layout: and its columns)', hint: 'see the data block of an analysis plan' });
  }
  const answers: Answers = {};
  if (!('answers' in top)) {
    problems.push({ code: 'missing-key', ...at([]), message: "the 'answers' mapping is missing", hint: 'add "answers:" followed by one "question_id: value" line per answer' });
  } else if (top.answers !== null && !isMapping(top.answers)) {
    problems.push({ code: 'wrong-type', ...at(['answers']), message: "'answers' must be a mapping of question ids to answers" });
  } else {
    const byId = new Map(rb.questions.map((q) => [q.id, q]));
    for (const [id, raw] of Object.entries((top.answers ?? {}) as Record<string, unknown>)) {
      const q = byId.get(id);
      if (!q) {
        problems.push({ code: 'unknown-key', ...at(['answers', id], true), message: `'${id}' is not a question of the rule base`, hint: suggest(id, [...byId.keys()]) });
        continue;
      }
      const c = checkValue(q, raw);
      if (c.ok) answers[id] = c.value;
      else problems.push({ code: c.code, ...at(['answers', id]), message: c.message, hint: c.hint });
    }
  }
  if (problems.length) fail(problems);
  return { answers, ...(title !== undefined ? { title } : {}), ...(data !== undefined ? { data } : {}), file };
}

/** "did you mean ...?" for a near miss, else the list of known ids. */
function suggest(id: string, known: string[]): string {
  const near = known.filter((k) => distance(id.toLowerCase(), k.toLowerCase()) <= 2);
  if (near.length) return `did you mean ${near.map((k) => `'${k}'`).join(' or ')}?`;
  return `known question ids: ${known.join(', ')}`;
}

/** Levenshtein edit distance (insertions, deletions, substitutions each cost 1). */
function distance(a: string, b: string): number {
  let prev = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const cur = [i];
    for (let j = 1; j <= b.length; j++) cur[j] = Math.min(prev[j] + 1, cur[j - 1] + 1, prev[j - 1] + (a[i - 1] === b[j - 1] ? 0 : 1));
    prev = cur;
  }
  return prev[b.length];
}

export interface AnswersTextOptions {
  title?: string;
  data?: object;
  /** The schema path or URL for the editor modeline; see answersSchemaRef. */
  schemaRef?: string;
}

/**
 * The answers as a commented YAML file: each answer follows a comment with its question (and,
 * for choices, the allowed values), with the chosen choice's label at the end of the line.
 * Answers are written in the rule base's asking order.
 */
export function answersToText(answers: Answers, rb: RuleBaseView, opts: AnswersTextOptions = {}): string {
  const byId = new Map(rb.questions.map((q) => [q.id, q]));
  const unknown = Object.keys(answers).filter((id) => !byId.has(id));
  if (unknown.length) throw new Error(`answers to unknown questions cannot be written: ${unknown.join(', ')}`);
  const ordered: Answers = {};
  for (const q of rb.questions) if (Object.prototype.hasOwnProperty.call(answers, q.id)) ordered[q.id] = answers[q.id];
  const doc = new Document({
    format: ANSWERS_FORMAT,
    ...(opts.title !== undefined ? { title: opts.title } : {}),
    answers: ordered,
    ...(opts.data !== undefined ? { data: opts.data } : {}),
  });
  const ref = opts.schemaRef ?? answersSchemaRef();
  doc.commentBefore = [
    ` yaml-language-server: $schema=${ref}`,
    ` Answers to the questions of tandem advise (written by tandem ${VERSION}).`,
    ' Use them again with: tandem advise --answers <this file>',
  ].join('\n');
  const map = doc.get('answers', true) as YAMLMap<Scalar, Scalar> | undefined;
  ((map?.items ?? []) as Pair<Scalar, Scalar>[]).forEach((pair, i) => {
    // Texts that name earlier answers ("{first_label|the first condition}") read with these answers.
    const q = questionAsShown(byId.get(String(pair.key.value)) as Question, answers);
    pair.key.commentBefore = commentFor(q);
    pair.key.spaceBefore = i > 0; // a blank line between answers
    if (q.type === 'choice' && isScalar(pair.value)) {
      const label = q.choices?.find((c) => c.value === pair.value?.value)?.label;
      if (label) pair.value.comment = ' ' + flat(label);
    }
  });
  const dataKey = (doc.contents as YAMLMap<Scalar, unknown>).items.find((p) => p.key.value === 'data')?.key;
  if (dataKey) {
    dataKey.spaceBefore = true;
    dataKey.commentBefore = ' How the data file holds the two conditions (checked by tandem plan check).';
  }
  return doc.toString({ lineWidth: 0 });
}

function commentFor(q: Question): string {
  const lines = [' ' + flat(q.text)];
  if (q.type === 'choice') lines.push(` one of: ${(q.choices ?? []).map((c) => c.value).join(', ')}`);
  if (q.optional) lines.push(' optional: "" leaves it blank');
  return lines.join('\n');
}

const flat = (s: string): string => s.replace(/\s+/g, ' ').trim();

/**
 * The modeline's schema reference: relative to the file being written when its path is given
 * (so editors find the schema of the tandem that wrote it), else the schema's file URL.
 */
export function answersSchemaRef(targetFile?: string): string {
  const schema = join(schemasDir(), ANSWERS_SCHEMA_FILE);
  if (targetFile === undefined) return pathToFileURL(schema).href;
  const rel = relative(dirname(resolve(targetFile)), schema);
  if (isAbsolute(rel)) return pathToFileURL(schema).href; // another drive (Windows)
  return rel.split(sep).join('/');
}

/** Writes the answers file without replacing an existing file unless `force` (OutputError). */
export async function writeAnswersFile(path: string, answers: Answers, rb: RuleBaseView, opts: { title?: string; data?: object; force?: boolean } = {}): Promise<void> {
  const text = answersToText(answers, rb, { title: opts.title, data: opts.data, schemaRef: answersSchemaRef(path) });
  await writeFileAtomic(path, text, { force: opts.force });
}
