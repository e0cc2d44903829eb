/**
 * One result shape for every procedure (a plain object; formatting lives in src/report).
 * Procedures are pure: arrays in, a TestResult out, or a StatsError (src/errors.ts) that says why
 * the statistic cannot be computed.
 */

export type Alternative = 'two-sided' | 'greater' | 'less';

export const PROCEDURE_IDS = [
  'paired-t',
  'welch-t',
  'pooled-t',
  'signed-rank',
  'rank-sum',
  'mcnemar',
  'two-proportions',
  'crossover-t',
  'paired-equivalence',
  'welch-equivalence',
] as const;
export type ProcedureId = (typeof PROCEDURE_IDS)[number];

export interface ProcedureOptions {
  /** Direction of the alternative for `first - second` (or first vs second). Default two-sided. */
  alternative: Alternative;
  /** Confidence level of the interval, in (0, 1). Default 0.95. */
  confidence: number;
  /** Value of the difference under the null hypothesis. Default 0. */
  nullValue: number;
  /** Equivalence margin (> 0) for the equivalence procedures: the range is [-margin, +margin]. */
  margin?: number;
  /** Rank procedures: force 'exact' or 'normal'; default chooses by n and ties. */
  method?: 'auto' | 'exact' | 'normal';
  /** Continuity correction for normal approximations (rank tests, McNemar). Default true. */
  correction?: boolean;
}

export const DEFAULT_OPTIONS: ProcedureOptions = {
  alternative: 'two-sided',
  confidence: 0.95,
  nullValue: 0,
};

/** Inputs by design. Binary outcomes are arrays of 0 and 1 (1 = the event). */
export type ProcedureInput =
  | { kind: 'paired'; first: number[]; second: number[] }
  | { kind: 'independent'; first: number[]; second: number[] }
  /**
   * 2x2 crossover: each subject's two period values, by sequence group. Sequence "firstThenSecond"
   * received the first condition in period 1; "secondThenFirst" received the second condition in
   * period 1.
   */
  | {
      kind: 'crossover';
      firstThenSecond: { period1: number[]; period2: number[] };
      secondThenFirst: { period1: number[]; period2: number[] };
    };

export interface EffectSize {
  /** e.g. "d_z", "Hedges' g", "probability of superiority", "odds ratio". */
  name: string;
  /** The formula in words/symbols, e.g. "mean difference / SD of differences". */
  formula: string;
  value: number;
  /** Interval at the result's confidence level, or null when none is computed (say why in notes). */
  ci: [number, number] | null;
}

export interface Counts {
  /** Complete pairs used (paired designs). */
  pairs?: number;
  /** Values used in the first and second group (independent designs). */
  first?: number;
  second?: number;
  /** Values dropped before the procedure (filled in by the data layer). */
  dropped?: number;
  /** Rank procedures: zero differences removed, tied groups. */
  zeros?: number;
  ties?: number;
}

export interface TestResult {
  procedure: ProcedureId;
  /** A readable name, e.g. "paired t on the differences". */
  method: string;
  /** How it was computed when there are choices, e.g. "exact null distribution". */
  variant?: string;
  estimate: number;
  /** What the estimate is, e.g. "mean difference", "Hodges-Lehmann estimate". */
  estimateName: string;
  ci: [number, number];
  confidence: number;
  statistic: number;
  /** e.g. "t", "W+", "U", "z", "chi-square", "b" */
  statisticName: string;
  df: number | null;
  pValue: number;
  alternative: Alternative;
  nullValue: number;
  n: Counts;
  effectSize: EffectSize | null;
  /** Statements the reader needs: zero handling, approximations used, degenerate parts. */
  notes: string[];
  /** Procedure-specific numbers, e.g. discordant counts, both TOST p-values, the standard error. */
  details: Record<string, number | string | boolean | number[] | null>;
}

/** Diagnostics of one sample (the differences, or one group). Reported, never acted on. */
export interface SampleDiagnostics {
  label: string;
  n: number;
  mean: number;
  sd: number;
  median: number;
  min: number;
  max: number;
  q1: number;
  q3: number;
  skewness: number | null;
  /** Shapiro-Wilk (Royston 1995); null with `shapiroNote` when n is outside 3..5000 or no variation. */
  shapiro: { w: number; pValue: number } | null;
  shapiroNote?: string;
  /** Values outside [q1 - 1.5 IQR, q3 + 1.5 IQR] (common practice, no source). */
  outliers: { low: number; high: number; values: number[]; count: number };
  zeros: number;
  /** Number of values that share their value with at least one other. */
  tiedValues: number;
}
