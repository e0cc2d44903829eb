/**
 * What pairing buys, and how power grows with n.
 *
 * Comparison: for a single-measurement SD sigma, pairing leaves differences with SD
 * sigma * sqrt(2 (1 - rho)) (the variance of a difference of two measurements with correlation
 * rho). For rho = 0, 0.3, 0.5, 0.7, 0.9 (and the planned rho) the table gives the pairs needed, beside the units needed
 * in two independent groups with the same sigma and the same question. At rho = 0 pairing costs a
 * little (n - 1 degrees of freedom instead of 2n - 2) and gains nothing; the saving grows with rho.
 *
 * Curve: exact power at sizes from the minimum to beyond the answer, for the terminal plot.
 *
 * Example: difference 1, sigma 2, two-sided alpha 0.05, power 0.8: two groups need 64 + 64 = 128
 * units; pairs needed are 65 at rho 0, 46 at rho 0.3, 34 at rho 0.5, 21 at rho 0.7, 9 at rho 0.9.
 */
import { layoutFor, minimumN } from './power.js';
import { sampleSize, planPower } from './solve.js';
import type { ComparisonRow, CurvePoint, SizeSpec } from './types.js';

export const COMPARISON_RHOS = [0, 0.3, 0.5, 0.7, 0.9] as const;

/**
 * The comparison table, or null when the single-measurement SD is unknown (paired inputs given
 * only as the SD of differences or as d_z). Independent groups keep the spec's allocation ratio
 * and second SD when the spec is an independent design, and are balanced otherwise.
 */
export function pairingComparison(spec: SizeSpec): ComparisonRow[] | null {
  const sigma = spec.sd;
  if (sigma === undefined) return null;
  const indep: SizeSpec = {
    ...spec,
    design: 'independent',
    sd: sigma,
    sd2: spec.design === 'independent' ? spec.sd2 : undefined,
    ratio: spec.design === 'independent' ? spec.ratio : 1,
    rho: undefined,
  };
  const groups = sampleSize(indep).layout;
  // Pairs compare against a common spread: with Welch spreads, the pooled one.
  const pairSigma = spec.design === 'independent' && spec.sd2 !== undefined ? Math.sqrt((sigma * sigma + spec.sd2 * spec.sd2) / 2) : sigma;
  // The planned correlation joins the standard ones when it is not among them.
  const rhos: number[] = [...COMPARISON_RHOS];
  if (spec.design === 'paired' && spec.rho !== undefined && !rhos.some((r) => Math.abs(r - (spec.rho as number)) < 1e-9)) {
    rhos.push(spec.rho);
    rhos.sort((a, b) => a - b);
  }
  return rhos.map((rho) => {
    const sdDiff = pairSigma * Math.sqrt(2 * (1 - rho));
    const paired: SizeSpec = { ...spec, design: 'paired', sdDiff, sd: pairSigma, sd2: undefined, rho, ratio: 1 };
    const pairs = sampleSize(paired).layout.n;
    return { rho, sigma: pairSigma, sdDiff, pairs, independentTotal: groups.total, independentN: groups.n, independentN2: groups.n2 ?? groups.n };
  });
}

/**
 * Power at about `points` evenly spaced sizes from the minimum to past the answer (at least 1.6
 * times it); the grid is laid so that the answer itself is one of its points.
 */
export function powerCurve(spec: SizeSpec, answerN: number, points = 40): CurvePoint[] {
  const lo = minimumN(spec);
  const hi = Math.max(lo + 4, Math.ceil(answerN * 1.6));
  const step = Math.max(1, Math.ceil((hi - lo) / (points - 1)));
  const anchor = Math.min(Math.max(answerN, lo), hi);
  const sizes = new Set<number>([lo]);
  for (let n = anchor; n >= lo; n -= step) sizes.add(n);
  for (let n = anchor + step; n <= hi; n += step) sizes.add(n);
  return [...sizes]
    .sort((a, b) => a - b)
    .map((n) => ({ n, total: layoutFor(spec, n).total, power: planPower(spec, n) }));
}
