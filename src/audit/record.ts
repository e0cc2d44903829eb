/**
 * From a loaded audit record (YAML with positions) to an AuditRecord. Pure: the caller loads the
 * text and resolves the referenced answers or plan file (src/audit/read.ts).
 *
 * Reported numbers are taken from the YAML source node, not from the parsed value, so "0.0430"
 * keeps its trailing zero (see src/audit/digits.ts). Every problem is collected with its line and
 * column before anything is reported.
 */
import { isMap, isScalar, isSeq, type Node } from 'yaml';
import type { Problem } from '../problems.js';
import type { LoadedYaml } from '../yaml/load.js';
import { validateLoaded } from '../yaml/validate.js';
import type { DataMapping } from '../plan/types.js';
import type { Alternative } from '../stats/types.js';
import { parseLevel, parseReported } from './digits.js';
import { mapProcedureName } from './procedure-names.js';
import { AUDIT_FORMAT, type AuditRecord, type GroupSummary, type Reported, type ReportedNumber } from './types.js';

type Path = (string | number)[];

export interface ParsedRecord {
  record: AuditRecord;
  /** Files the study facts refer to, relative to the record. */
  refs: { answersFile?: string; planFile?: string };
  /** The `expect` block of a conformance case, if any. */
  expect?: { codes?: string[]; absent?: string[]; exit?: number; data?: string };
  problems: Problem[];
}

const NUMBER_FIELDS = ['df', 'statistic', 'pValue', 'estimate', 'se', 'sd', 'alpha'] as const;
const COUNT_FIELDS = ['n', 'n1', 'n2'] as const;

export function parseRecord(loaded: LoadedYaml, schema: object): ParsedRecord {
  const empty: AuditRecord = { file: loaded.file, title: '', reported: {} };
  const problems = validateLoaded(loaded, schema);
  if (problems.length) return { record: empty, refs: {}, problems };
  const v = loaded.value as Record<string, any>;
  if (v.format !== AUDIT_FORMAT) {
    return { record: empty, refs: {}, problems: [{ code: 'format-version', file: loaded.file, line: 1, col: 1, message: `format must be ${AUDIT_FORMAT}` }] };
  }
  const out: Problem[] = [];
  const num = (path: Path, kind: Kind = 'value'): ReportedNumber | undefined => readNumber(loaded, path, out, kind);

  const r = (v.reported ?? {}) as Record<string, any>;
  const reported: Reported = {};
  if (typeof r.procedure === 'string') {
    reported.procedureText = r.procedure;
    const m = mapProcedureName(r.procedure);
    if (m.id) reported.procedure = m.id;
    if (m.family) reported.procedureFamily = m.family;
  }
  if (r.difference) reported.difference = { first: String(r.difference.first), second: String(r.difference.second) };
  if (r.alternative) reported.alternative = r.alternative as Alternative;
  for (const k of ['pretest', 'pairing', 'comparisons', 'repeatedPerUnit', 'periodUsed', 'statisticName', 'claim'] as const) {
    if (r[k] !== undefined) (reported as Record<string, unknown>)[k] = r[k];
  }
  for (const k of NUMBER_FIELDS) if (r[k] !== undefined) reported[k] = num(['reported', k], k === 'pValue' ? 'p' : 'value');
  for (const k of COUNT_FIELDS) if (r[k] !== undefined) reported[k] = num(['reported', k], 'count');
  if (Array.isArray(r.groups)) {
    reported.groups = r.groups.map((g: Record<string, unknown>, i: number): GroupSummary => {
      const s: GroupSummary = {};
      if (typeof g.label === 'string') s.label = g.label;
      if (g.n !== undefined) s.n = num(['reported', 'groups', i, 'n'], 'count');
      if (g.mean !== undefined) s.mean = num(['reported', 'groups', i, 'mean']);
      if (g.sd !== undefined) s.sd = num(['reported', 'groups', i, 'sd']);
      return s;
    });
  }
  if (r.ci) {
    reported.ci = {};
    if (r.ci.lower !== undefined) reported.ci.lower = num(['reported', 'ci', 'lower']);
    if (r.ci.upper !== undefined) reported.ci.upper = num(['reported', 'ci', 'upper']);
    if (r.ci.level !== undefined) {
      const level = parseLevel(r.ci.level);
      if (level === undefined) out.push(problemAt(loaded, ['reported', 'ci', 'level'], `the confidence level '${r.ci.level}' is not a level`, 'write 0.95 or "95%"'));
      else reported.confidence = level;
    }
    if (reported.confidence === undefined && (reported.ci.lower || reported.ci.upper)) reported.confidence = 0.95;
  }
  if (r.effectSize) {
    const e = r.effectSize;
    reported.effectSize = { formula: e.formula ?? 'unstated', formulaStated: e.formulaStated ?? e.formula !== undefined };
    if (typeof e.name === 'string') reported.effectSize.name = e.name;
    if (e.value !== undefined) reported.effectSize.value = num(['reported', 'effectSize', 'value']);
  }
  if (r.equivalence) {
    const e = r.equivalence;
    const eq: NonNullable<Reported['equivalence']> = {};
    for (const k of ['margin', 'pLower', 'pUpper', 'decisionP'] as const) if (e[k] !== undefined) eq[k] = num(['reported', 'equivalence', k], k === 'margin' ? 'value' : 'p');
    if (e.decision) eq.decision = e.decision;
    reported.equivalence = eq;
  }
  fillCountsFromGroups(reported);

  const study = (v.study ?? {}) as Record<string, any>;
  const given = ['answers', 'answersFile', 'planFile'].filter((k) => study[k] !== undefined);
  if (given.length > 1) {
    out.push(problemAt(loaded, ['study', given[1]], `study gives both ${given[0]} and ${given[1]}`, 'give exactly one of answers, answersFile or planFile'));
  }
  const record: AuditRecord = { file: loaded.file, title: String(v.title), reported };
  if (typeof v.story === 'string') record.story = v.story.trim();
  if (study.answers) {
    record.answers = { ...study.answers };
    record.answersFrom = 'the record';
  }
  if (study.design) record.statedDesign = { family: study.design.family, ...(study.design.kind ? { kind: String(study.design.kind) } : {}) };
  if (v.data?.mapping) record.mapping = v.data.mapping as DataMapping;
  if (Array.isArray(v.data?.missing)) record.missing = v.data.missing.map(String);
  if (typeof v.data?.delimiter === 'string') record.delimiter = v.data.delimiter;
  const refs: ParsedRecord['refs'] = {};
  if (typeof study.answersFile === 'string') refs.answersFile = study.answersFile;
  if (typeof study.planFile === 'string') refs.planFile = study.planFile;
  const parsed: ParsedRecord = { record, refs, problems: out };
  if (v.expect) parsed.expect = v.expect;
  return parsed;
}

/** n1/n2 from the group summaries when not given directly, matched to the subtraction by label. */
function fillCountsFromGroups(r: Reported): void {
  const [g1, g2] = orderedGroups(r);
  if (!r.n1 && g1?.n) r.n1 = g1.n;
  if (!r.n2 && g2?.n) r.n2 = g2.n;
}

/**
 * The group summaries in subtraction order [first, second]: matched by label when the labels
 * name the conditions of `difference`, else in the order written.
 */
export function orderedGroups(r: Reported): [GroupSummary | undefined, GroupSummary | undefined] {
  const gs = r.groups ?? [];
  if (r.difference && gs.length === 2) {
    const norm = (s?: string): string => (s ?? '').trim().toLowerCase();
    const a = gs.find((g) => norm(g.label) === norm(r.difference!.first));
    const b = gs.find((g) => norm(g.label) === norm(r.difference!.second));
    if (a && b && a !== b) return [a, b];
  }
  return [gs[0], gs[1]];
}

/** count: a whole number, exact; p: a probability, may be a bound ("< 0.001"); value: anything else. */
type Kind = 'count' | 'value' | 'p';

function readNumber(loaded: LoadedYaml, path: Path, out: Problem[], kind: Kind): ReportedNumber | undefined {
  const count = kind === 'count';
  const node = nodeAt(loaded, path);
  const text = node && isScalar(node) ? (typeof node.source === 'string' ? node.source : String(node.value)) : undefined;
  const pos = node?.range ? loaded.lines.linePos(node.range[0]) : undefined;
  if (text === undefined) return undefined;
  const res = parseReported(text);
  const where = path.join('.');
  if (!res.ok) {
    out.push({ code: 'wrong-type', file: loaded.file, line: pos?.line, col: pos?.col, message: `${where}: ${res.message}` });
    return undefined;
  }
  const n = res.number;
  if (count && (!Number.isInteger(n.value) || n.value < 0 || n.bound)) {
    out.push({ code: 'wrong-type', file: loaded.file, line: pos?.line, col: pos?.col, message: `${where} must be a whole number of units; got '${text}'` });
    return undefined;
  }
  if (kind === 'value' && n.bound) {
    out.push({ code: 'wrong-type', file: loaded.file, line: pos?.line, col: pos?.col, message: `${where} must be a number as written, not a bound; got '${text}'`, hint: 'only p-values may be written as a bound such as "< 0.001"' });
    return undefined;
  }
  if (count) n.halfUnit = 0;
  if (pos) {
    n.line = pos.line;
    n.col = pos.col;
  }
  return n;
}

function nodeAt(loaded: LoadedYaml, path: Path): Node | undefined {
  let node: unknown = loaded.doc.contents;
  for (const seg of path) {
    if (isMap(node)) {
      const pair = node.items.find((p) => isScalar(p.key) && String(p.key.value) === String(seg));
      node = pair?.value;
    } else if (isSeq(node) && typeof seg === 'number') {
      node = node.items[seg];
    } else return undefined;
    if (!node) return undefined;
  }
  return node as Node;
}

function problemAt(loaded: LoadedYaml, path: Path, message: string, hint?: string): Problem {
  const node = nodeAt(loaded, path);
  const pos = node?.range ? loaded.lines.linePos(node.range[0]) : undefined;
  return { code: 'schema', file: loaded.file, line: pos?.line, col: pos?.col, message, ...(hint ? { hint } : {}) };
}
