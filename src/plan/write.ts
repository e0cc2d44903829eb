/**
 * Writing a plan as YAML people can read and edit: the editor modeline first (so editors validate
 * against schemas/plan-v1.schema.json), then `format: tandem-plan/1`, then the sections in a fixed
 * order, each with a comment saying what it is for. Same plan in, same bytes out.
 */
import { basename, dirname, isAbsolute, join, relative, resolve, sep } from 'node:path';
import { pathToFileURL } from 'node:url';
import { Document, isScalar, type Pair, type YAMLMap } from 'yaml';
import { writeFileAtomic } from '../fs/atomic.js';
import { schemasDir } from '../paths.js';
import type { Plan } from './types.js';

export const PLAN_SCHEMA_FILE = 'plan-v1.schema.json';

/** The fixed key order of each part of a plan; keys not listed follow in sorted order. */
const ORDER = {
  top: ['format', 'title', 'createdBy', 'created', 'study', 'design', 'difference', 'procedure', 'sensitivity', 'hypotheses', 'data', 'missingPolicy', 'conditions', 'scope', 'warnings', 'cautions', 'planning', 'answers'],
  study: ['unit', 'outcome', 'outcomeUnit', 'first', 'second', 'event'],
  design: ['family', 'kind', 'reasons'],
  procedure: ['id', 'alternative', 'confidence', 'nullValue', 'margin'],
  sensitivity: ['id', 'why'],
  hypotheses: ['nullSymbols', 'nullWords', 'alternativeSymbols', 'alternativeWords'],
  data: ['layout', 'id', 'sequence', 'firstThenSecond', 'secondThenFirst', 'period1', 'period2', 'group', 'condition', 'first', 'second', 'value', 'firstLevel', 'secondLevel', 'pairBy', 'missing', 'delimiter'],
  condition: ['id', 'text', 'check', 'basis'],
  scope: ['causal', 'generalize', 'text'],
  planning: ['difference', 'sd', 'sd2', 'sdDiff', 'rho', 'effectSize', 'alpha', 'power', 'ratio', 'attrition', 'n', 'margin'],
} as const;

const COMMENTS: Record<string, string> = {
  study: [
    ' What is measured, on what, under which two conditions. Differences are first minus second.',
    ' event (binary outcomes only): the data value that counts as the event, e.g. "cracked" or "1".',
  ].join('\n'),
  design: ' How the data were produced (from the interview answers) and why that is the design.',
  difference: ' The direction of subtraction, in words.',
  procedure: [
    ' The declared analysis, fixed before seeing the data.',
    ' alternative: two-sided, greater or less (for first minus second);',
    ' margin: equivalence aims only (equivalent: the difference lies within -margin to +margin).',
  ].join('\n'),
  sensitivity: [
    ' Sensitivity analysis declared now: reported beside the main result, never swapped in after',
    ' seeing the data (null: none).',
  ].join('\n'),
  hypotheses: ' Null and alternative hypotheses, consistent with the direction of subtraction.',
  data: [
    ' Where the values are in your CSV file.',
    ' EDIT the column names (and group or sequence values) below to match your file before running',
    ' tandem analyze. Layouts: wide (one row per unit, two value columns), long (id, condition and',
    ' value columns), groups (group and value columns), columns (one column per group), crossover.',
  ].join('\n'),
  missingPolicy: [
    ' drop-incomplete-pairs: a pair with a missing member is dropped whole and counted;',
    ' drop-missing-values: each missing value is dropped and counted.',
  ].join('\n'),
  conditions: ' Conditions to check before trusting the result, and how to check each.',
  scope: [
    ' What the conclusion may claim: cause and effect only with random assignment, generalization',
    ' only with random sampling.',
  ].join('\n'),
  warnings: ' Warnings about the design.',
  cautions: ' Cautions: tandem does not replace a qualified statistician, an ethics review or a protocol.',
  planning: ' Planning inputs read by tandem size PLAN (in the outcome unit).',
  answers: ' The interview answers that produced this plan, by question id.',
};

function ordered(obj: Record<string, unknown>, keys: readonly string[]): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const k of keys) if (obj[k] !== undefined) out[k] = obj[k];
  for (const k of Object.keys(obj).sort()) if (!(k in out) && obj[k] !== undefined) out[k] = obj[k];
  return out;
}

/** The plan as a plain object with every part in the fixed key order and no undefined values. */
export function normalizePlan(plan: Plan): Record<string, unknown> {
  const p = plan as unknown as Record<string, Record<string, unknown>>;
  const parts: Record<string, unknown> = { ...plan };
  for (const k of ['study', 'design', 'procedure', 'hypotheses', 'data', 'scope', 'planning'] as const) {
    if (p[k] && typeof p[k] === 'object') parts[k] = ordered(p[k], ORDER[k]);
  }
  if (plan.sensitivity) parts.sensitivity = ordered(plan.sensitivity as unknown as Record<string, unknown>, ORDER.sensitivity);
  parts.conditions = plan.conditions.map((c) => ordered(c as unknown as Record<string, unknown>, ORDER.condition));
  return ordered(parts, ORDER.top);
}

/** The schema's location as the plan file should name it: relative to the plan's folder. */
export function schemaReference(planPath: string): string {
  const schema = join(schemasDir(), PLAN_SCHEMA_FILE);
  const rel = relative(dirname(resolve(planPath)), schema);
  if (isAbsolute(rel)) return pathToFileURL(schema).href; // another drive (Windows)
  return rel.split(sep).join('/');
}

export function modeline(planPath: string): string {
  return `# yaml-language-server: $schema=${schemaReference(planPath)}`;
}

/** The plan's YAML text, to be written at `planPath` (which decides the modeline's relative path). */
export function writePlanText(plan: Plan, planPath: string): string {
  const doc = new Document(normalizePlan(plan));
  const name = basename(planPath);
  doc.commentBefore = [
    modeline(planPath).slice(1),
    '',
    ' tandem analysis plan. Decide everything here before looking at the outcome data.',
    ` Check it:  tandem plan check ${name}`,
    ` Run it:    tandem analyze ${name} --data YOUR_DATA.csv`,
  ].join('\n');
  const map = doc.contents as YAMLMap;
  for (const item of map.items as Pair[]) {
    if (!isScalar(item.key)) continue;
    const comment = COMMENTS[String(item.key.value)];
    if (comment) {
      item.key.commentBefore = comment;
      item.key.spaceBefore = true;
    }
  }
  return doc.toString({ lineWidth: 0, indentSeq: true });
}

/** Writes the plan atomically; refuses to replace an existing file unless `force`. */
export async function savePlan(plan: Plan, planPath: string, opts: { force?: boolean } = {}): Promise<void> {
  await writeFileAtomic(planPath, writePlanText(plan, planPath), opts);
}
