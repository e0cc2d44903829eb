/**
 * What the signed-rank and rank-sum procedures share: p-values from a counted exact distribution
 * or from the normal approximation, the ranks of the order statistics that bound the
 * Hodges-Lehmann interval, and the estimate and interval read at those ranks.
 *
 * Normal approximation with continuity correction c = 0.5 (when asked):
 *   greater: z = (S - mean - c) / sd,  p = P(Z >= z)
 *   less:    z = (S - mean + c) / sd,  p = P(Z <= z)
 *   two-sided: z = sign(S - mean) max(|S - mean| - c, 0) / sd,  p = min(1, 2 P(Z >= |z|))
 * The two-sided correction never overshoots the mean (a statistic within 0.5 of its mean gives
 * p = 1, as scipy's mannwhitneyu does; R's and scipy's wilcoxon instead flip the sign there, which
 * changes p only when |S - mean| < 0.5).
 * Exact: two-sided p = min(1, 2 min(P(S <= s), P(S >= s))) (as R and scipy).
 *
 * Interval (Hodges and Lehmann 1963, Annals of Mathematical Statistics 34:598-611; Hollander and
 * Wolfe 1999, 3.3 and 4.3): with the statistic's lower quantile q = min{s : P(S <= s) >= p},
 * p = alpha/2 (two-sided) or alpha (one-sided), and k = max(1, q), the interval runs from the k-th
 * to the (size + 1 - k)-th smallest of the Walsh averages (or pairwise differences); its exact
 * confidence is 1 - 2 P(S <= k - 1). This is how R's wilcox.test picks its exact interval. The
 * normal version replaces P(S <= s) by Phi((s + 0.5 - mean) / sd), giving
 * q = ceil(mean - 0.5 + z_p sd) (no tie correction: the interval inverts the continuous-data test).
 *
 * Example: signed-rank with 10 differences, 95% two-sided: q = 9 (P(W+ <= 8) = 0.0244 < 0.025
 * <= P(W+ <= 9) = 0.0322), so the interval is Walsh averages 9 and 47 of 55, confidence 0.9512.
 */
import { StatsError } from '../errors.js';
import { normalCdf, normalQuantile, normalSf } from './distributions.js';
import { lowerQuantile, type Tails } from './rank-exact.js';
import type { MatrixSelector } from './rank-select.js';
import type { Alternative } from './types.js';

/** How a rank procedure's p-value was obtained (exact counts, or the normal approximation). */
export interface RankTestPart {
  pValue: number;
  variant: string;
  note: string;
  /** Normal approximation only (null for the exact distribution). */
  z: number | null;
  sd: number | null;
  correction: boolean | null;
}

export function exactPValue(t: Tails, alternative: Alternative): number {
  if (alternative === 'greater') return t.upper;
  if (alternative === 'less') return t.lower;
  return Math.min(1, 2 * Math.min(t.lower, t.upper));
}

export function normalPValue(
  stat: number,
  mean: number,
  sd: number,
  alternative: Alternative,
  correction: boolean,
): { z: number; pValue: number } {
  const c = correction ? 0.5 : 0;
  const dev = stat - mean;
  if (alternative === 'greater') {
    const z = (dev - c) / sd;
    return { z, pValue: normalSf(z) };
  }
  if (alternative === 'less') {
    const z = (dev + c) / sd;
    return { z, pValue: normalCdf(z) };
  }
  const z = (Math.sign(dev) * Math.max(Math.abs(dev) - c, 0)) / sd;
  return { z, pValue: Math.min(1, 2 * normalSf(Math.abs(z))) };
}

export interface IntervalRanks {
  /** 1-based rank of the lower end, or null for an open lower end (alternative 'less'). */
  lower: number | null;
  /** 1-based rank of the upper end, or null for an open upper end (alternative 'greater'). */
  upper: number | null;
  /** Confidence the chosen ranks actually give (exact, or its normal approximation). */
  achieved: number;
  /** True when even the widest interval falls short of the requested confidence. */
  short: boolean;
}

/** Interval ranks from an exact counted distribution of the statistic. */
export function exactIntervalRanks(counts: Float64Array, size: number, confidence: number, alternative: Alternative, total?: number): IntervalRanks {
  const p = tailProbability(confidence, alternative);
  const { s, below } = lowerQuantile(counts, p, total);
  const k = Math.max(1, s);
  let all = total ?? 0;
  if (total === undefined) for (let i = 0; i < counts.length; i++) all += counts[i];
  const left = s >= 1 ? below : counts[0] / all;
  return ranksFor(k, size, left, alternative, confidence);
}

/** Interval ranks from the normal approximation to the statistic (mean size/2). */
export function normalIntervalRanks(size: number, sd: number, confidence: number, alternative: Alternative): IntervalRanks {
  const p = tailProbability(confidence, alternative);
  const mean = size / 2;
  const q = Math.ceil(mean - 0.5 + normalQuantile(p) * sd - 1e-9);
  const k = Math.min(Math.max(1, q), Math.floor((size + 1) / 2));
  const left = normalCdf((k - 1 + 0.5 - mean) / sd);
  return ranksFor(k, size, left, alternative, confidence);
}

function tailProbability(confidence: number, alternative: Alternative): number {
  const alpha = 1 - confidence;
  return alternative === 'two-sided' ? alpha / 2 : alpha;
}

function ranksFor(k: number, size: number, left: number, alternative: Alternative, confidence: number): IntervalRanks {
  const achieved = alternative === 'two-sided' ? 1 - 2 * left : 1 - left;
  const short = achieved < confidence - 1e-12;
  return {
    lower: alternative === 'less' ? null : k,
    upper: alternative === 'greater' ? null : size + 1 - k,
    achieved,
    short,
  };
}

/** Percent with up to 2 decimals, for notes. */
export function pct(x: number): string {
  return `${Number((100 * x).toFixed(2))}%`;
}

/**
 * The Hodges-Lehmann estimate (median of the Walsh averages or pairwise differences) and the
 * interval ends at `ranks`, divided by the data's power-of-two scale `f`.
 */
export function hodgesLehmann(sel: MatrixSelector, ranks: IntervalRanks, f: number, alternative: Alternative): { estimate: number; ci: [number, number] } {
  // One batch: the middle order statistic(s) and the interval ends share their first rounds.
  const ends = [ranks.lower, ranks.upper].filter((r): r is number => r !== null);
  const [middle, ...found] = sel.medianAnd(ends);
  const at = (r: number): number => found[ends.indexOf(r)];
  // `+ 0` folds -0 into 0 for the report.
  const ci: [number, number] = [
    ranks.lower === null ? -Infinity : at(ranks.lower) / f + 0,
    ranks.upper === null ? Infinity : at(ranks.upper) / f + 0,
  ];
  const estimate = middle / f + 0;
  assertRepresentable(estimate, ci, alternative);
  return { estimate, ci };
}

/** The data are finite, but an estimate or interval end beyond about 1.8e308 cannot be reported. */
function assertRepresentable(estimate: number, ci: [number, number], alternative: Alternative): void {
  const ends = [alternative === 'less' ? 0 : ci[0], alternative === 'greater' ? 0 : ci[1]];
  if (![estimate, ...ends].every(Number.isFinite)) {
    throw new StatsError(
      'not-finite',
      'the estimate or its interval exceeds the range of double-precision numbers (about 1.8e308); rescale the data (e.g. change the unit) and run again',
    );
  }
}
