/**
 * The audit's data: a colleague's reported analysis as read from an audit record
 * (`tandem-audit/1`, schema in schemas/audit-v1.schema.json), and the findings about it.
 * Everything here is plain data; src/audit/*.ts checks it, src/report/audit.ts formats it.
 */
import type { Answers, Recommendation } from '../engine/types.js';
import type { Alternative, ProcedureId, TestResult } from '../stats/types.js';
import type { DataMapping } from '../plan/types.js';
import type { LayoutSpec } from '../data/types.js';
import type { FindingCode } from './codes.js';

export const AUDIT_FORMAT = 'tandem-audit/1';

/**
 * A number as the colleague wrote it. The digits are kept so rounding can be judged: "0.0430"
 * has 4 decimals, so the true value lay in [0.04295, 0.04305] (`halfUnit` = 0.00005).
 * `bound` marks "< 0.001" style reports: the true value is below (or above) `value`.
 */
export interface ReportedNumber {
  /** The text as written, e.g. "0.0430", "< 0.001", "1.2e-5". */
  text: string;
  value: number;
  /** Half a unit in the last written place; 0 for counts written as whole numbers. */
  halfUnit: number;
  /** Significant digits written (for messages). */
  significant: number;
  bound?: '<' | '<=' | '>' | '>=';
  /** Where it was written, when known. */
  line?: number;
  col?: number;
}

export type EffectFormula =
  | 'd-z'
  | 'd-av'
  | 'd-pooled'
  | 'hedges-g'
  | 'glass-delta'
  | 'rank-biserial'
  | 'probability-of-superiority'
  | 'odds-ratio'
  | 'risk-difference'
  | 'unstated';

export type Pretest = 'none' | 'normality' | 'equal-spread' | 'both';

export type Claim = 'difference' | 'no-difference' | 'equivalent' | 'not-equivalent' | 'first-higher' | 'second-higher' | 'inconclusive';

export interface GroupSummary {
  label?: string;
  n?: ReportedNumber;
  mean?: ReportedNumber;
  sd?: ReportedNumber;
}

/** What the colleague did and wrote. Every field is optional. */
export interface Reported {
  /** The procedure id when it could be mapped, and the name as written. */
  procedure?: ProcedureId;
  procedureText?: string;
  /** The family of the procedure when only that is known (e.g. "independent t" without a variant). */
  procedureFamily?: 'paired' | 'independent' | 'crossover' | 'other';
  /** Each difference is `first` minus `second` (labels as the colleague wrote them). */
  difference?: { first: string; second: string };
  alternative?: Alternative;
  pretest?: Pretest;
  /** How the two measurements were put side by side, when the record says. */
  pairing?: 'id' | 'row-order' | 'matched-after' | 'none';
  /** How many pairwise tests were run on the same units (more than two time points). */
  comparisons?: number;
  /** Several measurements per unit entered as separate units. */
  repeatedPerUnit?: boolean;
  /** Period of each measurement recorded and used (crossover). */
  periodUsed?: boolean;
  n?: ReportedNumber;
  n1?: ReportedNumber;
  n2?: ReportedNumber;
  df?: ReportedNumber;
  statistic?: ReportedNumber;
  statisticName?: string;
  pValue?: ReportedNumber;
  estimate?: ReportedNumber;
  se?: ReportedNumber;
  /** Paired: SD of the differences. */
  sd?: ReportedNumber;
  /**
   * Summaries of each condition as reported, matched to `difference` by label (or taken in the
   * order first, second when no label matches): count, mean and SD.
   */
  groups?: GroupSummary[];
  ci?: { lower?: ReportedNumber; upper?: ReportedNumber; level?: ReportedNumber };
  /** Confidence level as a fraction, from `ci.level` (default 0.95 when an interval is given). */
  confidence?: number;
  alpha?: ReportedNumber;
  effectSize?: { name?: string; value?: ReportedNumber; formula: EffectFormula; formulaStated: boolean };
  equivalence?: {
    margin?: ReportedNumber;
    lower?: ReportedNumber;
    upper?: ReportedNumber;
    pLower?: ReportedNumber;
    pUpper?: ReportedNumber;
    decisionP?: ReportedNumber;
    decision?: 'equivalent' | 'not-equivalent';
  };
  claim?: Claim;
}

/** The study facts and the colleague's report, resolved from the record. */
export interface AuditRecord {
  file: string;
  title: string;
  story?: string;
  answers?: Answers;
  /** Where the answers came from, for the report. */
  answersFrom?: string;
  /** A design stated directly by the reviewer (used when there are no answers to classify). */
  statedDesign?: { family: 'paired' | 'independent' | 'other'; kind?: string };
  reported: Reported;
  /** How to read `--data` (from the record, or from the referenced plan). */
  mapping?: DataMapping | LayoutSpec;
  missing?: string[];
  delimiter?: ',' | ';' | '\t' | 'auto';
}

export type Severity = 'error' | 'warning' | 'note';

export interface Finding {
  code: FindingCode;
  severity: Severity;
  /** What is wrong, in plain words, with the numbers involved. */
  message: string;
  /** What the colleague can do about it. */
  fix: string;
  /** Recomputed values behind the finding (for JSON and the review's tables). */
  values?: Record<string, number | string | null>;
}

/** One number checked against its recomputation. */
export interface NumberCheck {
  what: string;
  reported: string;
  /** The range consistent with the other reported numbers and their rounding. */
  expected: [number, number] | null;
  ok: boolean | null;
  note?: string;
}

export interface DataComparison {
  file: string;
  pairing: string[];
  colleague: { label: string; result: TestResult | null; why?: string };
  recommended: { label: string; result: TestResult | null; why?: string } | null;
}

export interface AuditResult {
  record: AuditRecord;
  recommendation: Recommendation | null;
  /** Why there is no recommendation (no answers, or the answers are incomplete). */
  recommendationNote?: string;
  findings: Finding[];
  checks: NumberCheck[];
  data?: DataComparison;
}
