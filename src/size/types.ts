/**
 * Shapes shared by the sample-size modules (pure data; formatting lives in src/report/size.ts).
 *
 * Conventions: the difference is always first minus second, in the outcome's units, or in SD units
 * when the effect was given as a standardized effect size (then every spread is 1).
 */
import type { Alternative } from '../stats/types.js';

export type SizeDesign = 'paired' | 'independent';

/** The inputs after checking: every spread is known and positive. */
export interface SizeSpec {
  design: SizeDesign;
  /** Expected true difference (first - second); for equivalence, the expected true difference. */
  difference: number;
  /** Paired: SD of the within-pair differences. */
  sdDiff: number;
  /** SD of single measurements (paired: when known through --sd; independent: first group). */
  sd?: number;
  /** Independent: SD of the second group when it differs (Welch). */
  sd2?: number;
  /** Paired: correlation between the two members of a pair, when given. */
  rho?: number;
  /** Independent allocation n2 / n1. */
  ratio: number;
  alpha: number;
  /** Target power, in (0, 1). */
  power: number;
  alternative: Alternative;
  /** Expected share lost before analysis, in [0, 1). */
  attrition: number;
  /** Equivalence margin (> 0): the equivalence range is [-margin, +margin]. */
  margin?: number;
  /** True when the effect came as a standardized effect size (units are SDs). */
  standardized: boolean;
}

/** One candidate size and the quantities that decide its power. */
export interface Layout {
  /** Pairs (paired) or first-group size (independent). */
  n: number;
  /** Second-group size (independent only). */
  n2?: number;
  /** Units analysed: pairs, or n + n2. */
  total: number;
  /** Degrees of freedom of the t statistic (Welch: Satterthwaite at the planned sizes). */
  df: number;
  /** Standard error of the estimated mean difference. */
  se: number;
}

export type Question = 'sample-size' | 'power' | 'detectable-difference';

export interface SizeAnswer {
  question: Question;
  layout: Layout;
  /** Achieved power at this layout. */
  power: number;
  /** The difference that the power refers to (given, or found for 'detectable-difference'). */
  difference: number;
  /** Noncentrality difference / se (superiority questions). */
  ncp?: number;
  recruit: { n: number; n2?: number; total: number };
  /** True when the smallest allowed design already reaches the target power. */
  atMinimum: boolean;
  method: string;
}

export interface ComparisonRow {
  rho: number;
  /** SD of single measurements the row assumes (for Welch spreads, their root mean square). */
  sigma: number;
  sdDiff: number;
  pairs: number;
  /** Units in two independent groups with the same spread (n1 + n2). */
  independentTotal: number;
  independentN: number;
  independentN2: number;
}

export interface CurvePoint {
  n: number;
  total: number;
  power: number;
}
