/**
 * What every check needs, worked out once: the design (classified from the study facts, or as the
 * reviewer stated it), the procedure the colleague used and its family, the confidence level and
 * significance level, and the group summaries in subtraction order.
 */
import type { Recommendation } from '../engine/types.js';
import type { ProcedureId } from '../stats/types.js';
import { FINDING_CODES, type FindingCode } from './codes.js';
import { familyOf, PROCEDURE_LABEL, type ProcedureFamily } from './procedure-names.js';
import { orderedGroups } from './record.js';
import type { AuditRecord, Finding, GroupSummary, NumberCheck, Reported } from './types.js';

export interface AuditContext {
  record: AuditRecord;
  r: Reported;
  rec: Recommendation | null;
  design: { family: 'paired' | 'independent' | 'other'; kind?: string; label?: string } | null;
  used?: ProcedureId;
  usedFamily?: ProcedureFamily;
  /** The procedure as a reader should see it in a message. */
  usedLabel: string;
  confidence: number;
  alpha: number;
  first?: GroupSummary;
  second?: GroupSummary;
  /** "<first> minus <second>" when the subtraction is stated. */
  subtraction?: string;
  /**
   * The procedure to compare with: the rule base's recommendation, or, when the reviewer only
   * states the design, the default for that family (paired t, Welch t, the crossover analysis).
   */
  recommended?: ProcedureId;
  /** True when `recommended` is a default for a stated design, not the rule base's choice. */
  recommendedByDefault?: boolean;
  /** Why the study facts gave no recommendation (e.g. incomplete answers). */
  recommendationNote?: string;
}

/** Defaults for a design stated without answers (binary outcomes cannot be told apart: none). */
function defaultFor(design: AuditContext['design'], record: AuditRecord): ProcedureId | undefined {
  if (!design || record.answers?.outcome_type === 'binary') return undefined;
  if (design.kind === 'crossover') return 'crossover-t';
  if (design.family === 'paired') return 'paired-t';
  if (design.family === 'independent') return 'welch-t';
  return undefined;
}

export function makeContext(record: AuditRecord, rec: Recommendation | null, recommendationNote?: string): AuditContext {
  const r = record.reported;
  const used = r.procedure;
  const usedFamily = used ? familyOf(used) : r.procedureFamily;
  const design = rec
    ? { family: rec.design.family, kind: rec.design.kind, label: rec.design.label }
    : record.statedDesign
      ? { ...record.statedDesign }
      : null;

  // An equivalence test at level alpha goes with the 1 - 2 alpha interval (a 90% interval for
  // alpha = 0.05); every other test with the 1 - alpha interval. Rounded so 1 - 0.95 reads 0.05.
  const equivalence = used?.endsWith('equivalence') || r.equivalence !== undefined;
  const confidence = r.confidence ?? (r.alpha ? 1 - (equivalence ? 2 : 1) * r.alpha.value : equivalence ? 0.9 : 0.95);
  const fromLevel = r.confidence !== undefined ? (equivalence ? (1 - r.confidence) / 2 : 1 - r.confidence) : 0.05;
  const alpha = r.alpha?.value ?? Math.round(fromLevel * 1e9) / 1e9;
  const [first, second] = orderedGroups(r);
  const ctx: AuditContext = {
    record,
    r,
    rec,
    design,
    usedLabel: used ? PROCEDURE_LABEL[used] : r.procedureText ? `"${r.procedureText}"` : 'the procedure used',
    confidence,
    alpha,
  };
  if (used) ctx.used = used;
  if (usedFamily) ctx.usedFamily = usedFamily;
  if (first) ctx.first = first;
  if (second) ctx.second = second;
  if (recommendationNote) ctx.recommendationNote = recommendationNote;
  if (r.difference) ctx.subtraction = `${r.difference.first} minus ${r.difference.second}`;
  if (rec?.procedure.id) ctx.recommended = rec.procedure.id;
  else if (!rec) {
    const d = defaultFor(design, record);
    if (d) {
      ctx.recommended = d;
      ctx.recommendedByDefault = true;
    }
  }
  return ctx;
}

/** Collects findings and number checks; severity always comes from the code catalogue. */
export interface Collector {
  readonly findings: Finding[];
  readonly checks: NumberCheck[];
  add(code: FindingCode, message: string, fix: string, values?: Finding['values']): void;
  has(code: FindingCode): boolean;
  check(c: NumberCheck): void;
}

export function makeCollector(): Collector {
  const findings: Finding[] = [];
  const checks: NumberCheck[] = [];
  return {
    findings,
    checks,
    add(code, message, fix, values) {
      const f: Finding = { code, severity: FINDING_CODES[code].severity, message, fix };
      if (values) f.values = values;
      findings.push(f);
    },
    has: (code) => findings.some((f) => f.code === code),
    check: (c) => void checks.push(c),
  };
}

/** The unit's name from the study facts ('unit' when none given) and its plural, for messages. */
export function unitNames(ctx: AuditContext): { one: string; many: string } {
  const one = String(ctx.record.answers?.unit ?? 'unit');
  return { one, many: pluralOf(one) };
}

/**
 * A regular English plural of the unit's last word: "colony" -> "colonies", "batch" -> "batches",
 * "loaf" -> "loaves", otherwise an added "s". Irregular nouns are out of reach; the common
 * endings are enough for the units people name.
 */
function pluralOf(word: string): string {
  if (/(s|x|z|ch|sh)$/i.test(word)) return `${word}es`;
  if (/[^aeiou]y$/i.test(word)) return `${word.slice(0, -1)}ies`;
  if (/(l|ea|oa|ar)f$/i.test(word)) return `${word.slice(0, -1)}ves`;
  return `${word}s`;
}

/** The number as written, for messages: `"0.0430"`. */
export function q(text: string | undefined): string {
  return text === undefined ? 'n/a' : `${text}`;
}
