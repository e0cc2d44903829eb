/**
 * Fisher's exact test for a 2x2 table and the conditional odds ratio with its exact interval.
 *
 * With margins fixed (n1, n2 group sizes, K events in all, N = n1 + n2), the events X in the
 * first group follow the hypergeometric law
 *   P(X = x) = C(n1, x) C(n2, K - x) / C(N, K),  max(0, K - n2) <= x <= min(K, n1)
 * (Fisher 1935, Journal of the Royal Statistical Society 98:39-82). Probabilities are built in
 * log space from gammaln (distributions.ts) and normalised by their sum, so no factorial
 * overflows; long supports use the term ratio
 *   P(x + 1) / P(x) = (n1 - x)(K - x) / ((x + 1)(n2 - K + x + 1))
 * re-anchored on the exact gammaln value every 64 terms.
 * One-sided p: greater = P(X >= x1), less = P(X <= x1). Two-sided p: the sum of P(x) over all
 * tables no more probable than the observed, with a relative tolerance of 1e-7 so equal
 * probabilities are not split by rounding (the rule of R's fisher.test).
 *
 * Odds ratio: the conditional maximum-likelihood estimate, the psi solving E_psi[X] = x1 under the
 * noncentral hypergeometric law P_psi(x) ~ C(n1, x) C(n2, K - x) psi^x, with the exact
 * conditional interval P_psi_L(X >= x1) = alpha/2, P_psi_U(X <= x1) = alpha/2 (Cornfield 1956,
 * Proceedings of the Third Berkeley Symposium 4:135-148; as R's fisher.test and scipy's
 * contingency.odds_ratio). 0 or Infinity at the edges of the support. Each root by bisection on
 * log psi; for long supports only a window of +/- 60 standard deviations around x1 is summed.
 *
 * Example: 3/10 events against 9/10 gives P(X <= 3) = 0.009883 (less) and two-sided p = 0.01977;
 * conditional odds ratio 0.0579, 95% interval [0.00095, 0.721] (scipy 1.10's fisher_exact and
 * contingency.odds_ratio give the same).
 */
import { logChoose } from './distributions.js';
import type { Alternative } from './types.js';

export interface Hypergeometric {
  lo: number;
  hi: number;
  /** log of the unnormalised weights C(n1, x) C(n2, K - x), x = lo..hi. */
  logw: Float64Array;
}

export function hypergeometric(n1: number, n2: number, K: number, from?: number, to?: number): Hypergeometric {
  const lo = Math.max(0, K - n2, from ?? 0);
  const hi = Math.min(K, n1, to ?? Infinity);
  const logw = new Float64Array(hi - lo + 1);
  for (let x = lo; x <= hi; x++) {
    const i = x - lo;
    if (i % 64 === 0) logw[i] = logChoose(n1, x) + logChoose(n2, K - x);
    else logw[i] = logw[i - 1] + Math.log(((n1 - x + 1) * (K - x + 1)) / (x * (n2 - K + x)));
  }
  return { lo, hi, logw };
}

/** Fisher's exact p-value for x1 events of n1 against x2 of n2. */
export function fisherPValue(x1: number, n1: number, x2: number, n2: number, alternative: Alternative): number {
  const h = hypergeometric(n1, n2, x1 + x2);
  const shift = max(h.logw);
  const p = new Float64Array(h.logw.length);
  for (let i = 0; i < p.length; i++) p[i] = Math.exp(h.logw[i] - shift);
  let total = 0;
  for (let i = 0; i < p.length; i++) total += p[i];
  const at = x1 - h.lo;
  let sum = 0;
  if (alternative === 'greater') for (let i = p.length - 1; i >= at; i--) sum += p[i];
  else if (alternative === 'less') for (let i = 0; i <= at; i++) sum += p[i];
  else {
    const limit = p[at] * (1 + 1e-7);
    for (let i = 0; i < p.length; i++) if (p[i] <= limit) sum += p[i];
  }
  return Math.min(1, sum / total);
}

/** Conditional MLE of the odds ratio and its exact conditional interval. */
export function conditionalOddsRatio(x1: number, n1: number, x2: number, n2: number, confidence: number, alternative: Alternative): { estimate: number; ci: [number, number] } {
  const K = x1 + x2;
  const N = n1 + n2;
  const sd = Math.sqrt((n1 * n2 * K * (N - K)) / (N * N * Math.max(1, N - 1)));
  const width = Math.ceil(60 * sd + 60);
  const h = hypergeometric(n1, n2, K, x1 - width, x1 + width);
  const lo = Math.max(0, K - n2);
  const hi = Math.min(K, n1);
  const alpha = 1 - confidence;
  const tail = alternative === 'two-sided' ? alpha / 2 : alpha;
  const estimate = x1 === lo ? 0 : x1 === hi ? Infinity : Math.exp(solve((t) => moments(h, t, x1).mean - x1));
  const lower = alternative === 'less' || x1 === lo ? 0 : Math.exp(solve((t) => moments(h, t, x1).atLeast - tail));
  const upper = alternative === 'greater' || x1 === hi ? Infinity : Math.exp(solve((t) => tail - moments(h, t, x1).atMost));
  return { estimate, ci: [lower, upper] };
}

/** Mean, P(X >= x1) and P(X <= x1) under the noncentral law with log odds ratio t. */
function moments(h: Hypergeometric, t: number, x1: number): { mean: number; atLeast: number; atMost: number } {
  let shift = -Infinity;
  for (let i = 0; i < h.logw.length; i++) shift = Math.max(shift, h.logw[i] + (h.lo + i) * t);
  let total = 0;
  let mean = 0;
  let atLeast = 0;
  let atMost = 0;
  for (let i = 0; i < h.logw.length; i++) {
    const x = h.lo + i;
    const w = Math.exp(h.logw[i] + x * t - shift);
    total += w;
    mean += x * w;
    if (x >= x1) atLeast += w;
    if (x <= x1) atMost += w;
  }
  return { mean: mean / total, atLeast: atLeast / total, atMost: atMost / total };
}

/** Root of an increasing function of t by bracketing then bisection. */
function solve(g: (t: number) => number): number {
  let a = -1;
  let b = 1;
  while (g(a) > 0 && a > -1e3) a *= 2;
  while (g(b) < 0 && b < 1e3) b *= 2;
  for (let i = 0; i < 200 && b - a > 1e-13 * Math.max(1, Math.abs(a), Math.abs(b)); i++) {
    const m = (a + b) / 2;
    if (g(m) < 0) a = m;
    else b = m;
  }
  return (a + b) / 2;
}

function max(a: Float64Array): number {
  let m = -Infinity;
  for (let i = 0; i < a.length; i++) if (a[i] > m) m = a[i];
  return m;
}
