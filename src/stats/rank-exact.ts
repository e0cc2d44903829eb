/**
 * Exact null distributions of the two Wilcoxon statistics, by dynamic programming (counting), for
 * samples without ties.
 *
 * Signed-rank W+ (Wilcoxon 1945, "Individual comparisons by ranking methods", Biometrics Bulletin
 * 1:80-83): under the null each of the n ranks carries a + sign with probability 1/2 independently,
 * so the number of sign patterns with W+ = s is the number of subsets of {1..n} summing to s:
 *   c_k(s) = c_{k-1}(s) + c_{k-1}(s - k),   P(W+ = s) = c_n(s) / 2^n.
 * Counts are integers below 2^n, held exactly in float64 up to n = 53 (so for the usual n <= 50 the
 * tail sums and the one division are exact to the last bit); beyond, every step is an addition of
 * positive numbers, so the relative error stays near n * 2^-53.
 *
 * Rank-sum U (Mann and Whitney 1947, Annals of Mathematical Statistics 18:50-60): U of the first
 * sample is the number of (first, second) pairs in which the first value is larger. Under the null
 * every choice of which m of the N = m + n ordered positions belong to the first sample is equally
 * likely. Walking the positions k = 1..N, a position taken as the j-th member of the smaller sample
 * adds k - j (the members of the other sample below it) to U:
 *   f_k(j, u) = f_{k-1}(j, u) + f_{k-1}(j - 1, u - (k - j)),  P(U = u) = f_N(min(m,n), u) / C(N, m).
 * The distribution is symmetric about mn/2 and the same for (m, n) and (n, m). All additions again.
 *
 * Example: n = 10 pairs, W+ = 8: P(W+ <= 8) = 25/1024 = 0.0244140625 (Hollander and Wolfe 1999,
 * Table A.4, from memory). Rank-sum m = n = 4: P(U <= 1) = 2/70 = 0.028571.
 */

/**
 * Above these sizes an exact distribution is refused. The work grows as n^3 for the signed-rank
 * counts and as (m + n) min(m, n) m n for the rank-sum counts (`rankSumCost`).
 */
export const SIGNED_RANK_EXACT_MAX = 500;
export const RANK_SUM_EXACT_MAX_COST = 2e8;

const signedCache = new Map<number, Float64Array>();

/**
 * Counts c(s) of sign patterns with W+ = s, s = 0..n(n+1)/2 (total 2^n). Only the lower half is
 * computed by the recurrence (no sum above it feeds a sum below it); the upper half is mirrored
 * from the symmetry c(s) = c(n(n+1)/2 - s), which halves the work.
 */
export function signedRankCounts(n: number): Float64Array {
  const hit = signedCache.get(n);
  if (hit) return hit;
  const top = (n * (n + 1)) / 2;
  const half = Math.floor(top / 2);
  const c = new Float64Array(top + 1);
  c[0] = 1;
  let reach = 0;
  for (let k = 1; k <= n; k++) {
    reach = Math.min(half, reach + k);
    for (let s = reach; s >= k; s--) c[s] += c[s - k];
  }
  for (let s = half + 1; s <= top; s++) c[s] = c[top - s];
  if (signedCache.size > 16) signedCache.clear();
  signedCache.set(n, c);
  return c;
}

/** Counts f(u), u = 0..m n, of arrangements with U = u; the total is C(m + n, m). */
export function rankSumCounts(m: number, n: number): Float64Array {
  const c = Math.min(m, n);
  const N = m + n;
  const width = m * n + 1;
  // Row j holds the counts with j members of the smaller sample placed so far.
  const f = new Float64Array((c + 1) * width);
  f[0] = 1;
  for (let k = 1; k <= N; k++) {
    const jMax = Math.min(k, c);
    const jMin = Math.max(1, c - (N - k));
    for (let j = jMax; j >= jMin; j--) {
      const add = k - j;
      const row = j * width;
      const prev = (j - 1) * width;
      const uMax = Math.min((j - 1) * (k - j) + add, width - 1);
      for (let u = uMax; u >= add; u--) f[row + u] += f[prev + u - add];
    }
  }
  return f.slice(c * width, (c + 1) * width);
}

export function rankSumCost(m: number, n: number): number {
  return (m + n) * Math.min(m, n) * (m * n + 1);
}

export interface Tails {
  /** P(S <= s) */
  lower: number;
  /** P(S >= s) */
  upper: number;
}

/**
 * Both tails of a counted distribution at integer s, each summed from its extreme end inward
 * (smallest terms first), divided once by the total.
 */
export function tailsOf(counts: Float64Array, s: number, total?: number): Tails {
  const top = counts.length - 1;
  let all = total ?? 0;
  if (total === undefined) for (let i = 0; i <= top; i++) all += counts[i];
  let lower = 0;
  for (let i = 0; i <= Math.min(s, top); i++) lower += counts[i];
  let upper = 0;
  for (let i = top; i >= Math.max(s, 0); i--) upper += counts[i];
  return { lower: Math.min(1, lower / all), upper: Math.min(1, upper / all) };
}

/**
 * The smallest s with P(S <= s) >= p (the lower p-quantile, as R's qsignrank / qwilcox define it),
 * and P(S <= s - 1), the probability left strictly below it.
 */
export function lowerQuantile(counts: Float64Array, p: number, total?: number): { s: number; below: number } {
  let all = total ?? 0;
  if (total === undefined) for (let i = 0; i < counts.length; i++) all += counts[i];
  let cum = 0;
  for (let s = 0; s < counts.length; s++) {
    const next = cum + counts[s];
    // A relative slack of 1e-12 keeps an exactly attainable level from being missed by rounding.
    if (next / all >= p * (1 - 1e-12)) return { s, below: cum / all };
    cum = next;
  }
  return { s: counts.length - 1, below: 1 };
}

/** 2^n as a number (exact for n <= 1023). */
export function twoPow(n: number): number {
  return Math.pow(2, n);
}
