/**
 * Exact power of the t tests for a mean difference.
 *
 * Under the alternative the t statistic (estimate - 0) / SE-hat follows a noncentral t with
 * noncentrality ncp = difference / SE, where SE is the true standard error of the estimate:
 *   paired (one-sample t on the differences): df = n - 1, SE = sdDiff / sqrt(n);
 *   two groups, pooled: df = n1 + n2 - 2, SE = sd * sqrt(1/n1 + 1/n2);
 *   two groups, Welch (unequal spreads): SE = sqrt(sd1^2/n1 + sd2^2/n2) and df from the
 *     Welch-Satterthwaite formula at the planned sizes and the assumed spreads (Welch 1947,
 *     Satterthwaite 1946). This treats Welch's statistic as exactly noncentral t with that df,
 *     an approximation; Moser, Stevens and Watts (1989, Communications in Statistics - Theory and
 *     Methods 18) found it close to the exact power of Welch's test.
 * Power (Owen 1965, Biometrika 52; the standard result) with c the critical value:
 *   two-sided: P(T' > c) + P(T' < -c), c = t(1 - alpha/2, df) -- both tails counted;
 *   greater:   P(T' > c), c = t(1 - alpha, df);   less: P(T' < -c).
 *
 * Example: 20 pairs, difference 3, sdDiff 6.7082 (d_z = 0.4472, ncp = 2), two-sided alpha 0.05:
 * df = 19, c = 2.0930, power = P(T' > 2.093) + P(T' < -2.093) = 0.47555 + 0.00006 = 0.47561.
 */
import { noncentralTCdf, noncentralTSf } from '../stats/noncentral-t.js';
import { tQuantile } from '../stats/distributions.js';
import type { Alternative } from '../stats/types.js';
import type { Layout, SizeSpec } from './types.js';

/** The smallest allowed size: two pairs, or two units in each group. */
export function minimumN(spec: SizeSpec): number {
  if (spec.design === 'paired') return 2;
  // n2 = ceil(ratio * n1) must also be at least 2.
  let n = 2;
  while (secondGroup(n, spec.ratio) < 2) n++;
  return n;
}

/** Second-group size for a first-group size n: ceil(ratio * n) (common practice, no source). */
export function secondGroup(n: number, ratio: number): number {
  return Math.max(1, Math.ceil(ratio * n - 1e-9));
}

/** True when the two groups are planned with different spreads (Welch's test). */
export function isWelch(spec: SizeSpec): boolean {
  return spec.design === 'independent' && spec.sd2 !== undefined && spec.sd2 !== spec.sd;
}

/** Welch-Satterthwaite degrees of freedom for the given sizes and spreads. */
export function welchDf(sd1: number, n1: number, sd2: number, n2: number): number {
  const v1 = (sd1 * sd1) / n1;
  const v2 = (sd2 * sd2) / n2;
  return ((v1 + v2) * (v1 + v2)) / ((v1 * v1) / (n1 - 1) + (v2 * v2) / (n2 - 1));
}

/** The planned layout for a size n (pairs, or first-group size). */
export function layoutFor(spec: SizeSpec, n: number): Layout {
  if (spec.design === 'paired') {
    return { n, total: n, df: n - 1, se: spec.sdDiff / Math.sqrt(n) };
  }
  const n2 = secondGroup(n, spec.ratio);
  const sd1 = spec.sd ?? 1;
  if (isWelch(spec)) {
    const sd2 = spec.sd2 as number;
    return { n, n2, total: n + n2, df: welchDf(sd1, n, sd2, n2), se: Math.sqrt((sd1 * sd1) / n + (sd2 * sd2) / n2) };
  }
  return { n, n2, total: n + n2, df: n + n2 - 2, se: sd1 * Math.sqrt(1 / n + 1 / n2) };
}

/** Critical value of the test at this df. */
export function criticalT(alpha: number, df: number, alternative: Alternative): number {
  return tQuantile(alternative === 'two-sided' ? 1 - alpha / 2 : 1 - alpha, df);
}

/** Exact power for noncentrality ncp at df. */
export function powerAtNcp(ncp: number, df: number, alpha: number, alternative: Alternative): number {
  const c = criticalT(alpha, df, alternative);
  if (alternative === 'greater') return noncentralTSf(c, df, ncp);
  if (alternative === 'less') return noncentralTCdf(-c, df, ncp);
  return noncentralTSf(c, df, ncp) + noncentralTCdf(-c, df, ncp);
}
