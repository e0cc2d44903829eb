/**
 * The three planning questions for one design:
 *   sample size       -- the smallest n with exact power >= target (checked at n and n - 1);
 *   power at n        -- exact power for a given n and difference;
 *   detectable diff.  -- the smallest true difference reaching the target power at a given n
 *                        (the noncentrality solved from the exact power, times the SE).
 * Superiority questions use the noncentral t power of src/size/power.ts; equivalence (a margin is
 * set) uses the TOST power of src/size/equivalence.ts. Attrition inflates each group separately:
 * recruit = ceil(n / (1 - attrition)) (common practice, no source).
 *
 * Example: paired, difference 2.5, sdDiff 4, two-sided alpha 0.05, power 0.8, attrition 0.1:
 * 23 pairs (power 0.8171; 22 pairs give 0.7982), recruit ceil(23 / 0.9) = 26.
 */
import { normalQuantile } from '../stats/distributions.js';
import { tostPower } from './equivalence.js';
import { criticalT, layoutFor, minimumN, powerAtNcp, isWelch } from './power.js';
import { smallestN, solveIncreasing } from './search.js';
import type { Layout, SizeAnswer, SizeSpec } from './types.js';

/** Exact power of the planned analysis at size n (superiority, or TOST when a margin is set). */
export function planPower(spec: SizeSpec, n: number, difference = spec.difference): number {
  const l = layoutFor(spec, n);
  if (spec.margin !== undefined) return tostPower(l.se, l.df, difference, spec.margin, criticalT(spec.alpha, l.df, 'greater'));
  return powerAtNcp(difference / l.se, l.df, spec.alpha, spec.alternative);
}

/** Variance of the estimate times n (n = pairs or first-group size), for the normal seed. */
function varianceFactor(spec: SizeSpec): number {
  if (spec.design === 'paired') return spec.sdDiff * spec.sdDiff;
  const s1 = spec.sd ?? 1;
  const s2 = spec.sd2 ?? s1;
  return s1 * s1 + (s2 * s2) / spec.ratio;
}

/** Normal-approximation size: only a starting point for the exact search. */
export function normalSeed(spec: SizeSpec): number {
  const v = varianceFactor(spec);
  if (spec.margin !== undefined) {
    const gap = spec.margin - Math.abs(spec.difference);
    const zb = spec.difference === 0 ? normalQuantile(1 - (1 - spec.power) / 2) : normalQuantile(spec.power);
    const z = normalQuantile(1 - spec.alpha) + zb;
    return (z * z * v) / (gap * gap);
  }
  const za = normalQuantile(spec.alternative === 'two-sided' ? 1 - spec.alpha / 2 : 1 - spec.alpha);
  const z = za + normalQuantile(spec.power);
  return (z * z * v) / (spec.difference * spec.difference);
}

function recruitFor(spec: SizeSpec, l: Layout): SizeAnswer['recruit'] {
  const up = (k: number): number => Math.ceil(k / (1 - spec.attrition) - 1e-9);
  if (l.n2 === undefined) return { n: up(l.n), total: up(l.n) };
  return { n: up(l.n), n2: up(l.n2), total: up(l.n) + up(l.n2) };
}

export function methodText(spec: SizeSpec): string {
  const welch = isWelch(spec) ? ' with Welch-Satterthwaite degrees of freedom at the planned sizes (an approximation)' : '';
  if (spec.margin !== undefined) {
    return `exact power of two one-sided tests, integrated over the distribution of the estimated SD${welch}`;
  }
  return `exact power from the noncentral t distribution${welch}`;
}

export function sampleSize(spec: SizeSpec): SizeAnswer {
  const found = smallestN((n) => planPower(spec, n), spec.power, minimumN(spec), normalSeed(spec));
  return answer(spec, 'sample-size', found.n, found.power, spec.difference, found.atMinimum);
}

export function powerAtSize(spec: SizeSpec, n: number): SizeAnswer {
  return answer(spec, 'power', n, planPower(spec, n), spec.difference, false);
}

/** Smallest detectable difference at size n (superiority only), signed by the alternative. */
export function detectableDifference(spec: SizeSpec, n: number): SizeAnswer {
  const l = layoutFor(spec, n);
  const alt = spec.alternative === 'less' ? 'greater' : spec.alternative;
  const za = normalQuantile(alt === 'two-sided' ? 1 - spec.alpha / 2 : 1 - spec.alpha);
  const ncp = solveIncreasing((x) => powerAtNcp(x, l.df, spec.alpha, alt), spec.power, 0, za + normalQuantile(spec.power));
  const diff = (spec.alternative === 'less' ? -1 : 1) * ncp * l.se;
  return answer(spec, 'detectable-difference', n, planPower(spec, n, diff), diff, false);
}

function answer(spec: SizeSpec, question: SizeAnswer['question'], n: number, power: number, difference: number, atMinimum: boolean): SizeAnswer {
  const layout = layoutFor(spec, n);
  const ncp = spec.margin === undefined ? difference / layout.se : undefined;
  return { question, layout, power, difference, ncp, recruit: recruitFor(spec, layout), atMinimum, method: methodText(spec) };
}
