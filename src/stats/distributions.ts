/**
 * The one typed door to distribution functions. jstat is imported here and nowhere else, and only
 * for what was measured sound (../shared/DEPENDENCIES.md): starting values for the t and normal
 * quantiles. The CDFs come from the special functions of src/stats/special.ts (published
 * algorithms in one small file); where those do not converge (very large shape parameters) the
 * @stdlib packages, measured at relative error below 1e-13, take over.
 *
 * Every tail is computed directly: `tSf(t, df)` is `tCdf(-t, df)`, never `1 - tCdf(t, df)`, so a
 * p-value of 1e-12 keeps its digits.
 */
import { createRequire } from 'node:module';
import jStat from 'jstat';
import { betaRegularized, gammaln as specialGammaln, gammaRegularized } from './special.js';

/*
 * The @stdlib packages are CommonJS spread over hundreds of small files (about 0.2 s to load), so
 * they are the fallback only, each required on first use.
 */
const require = createRequire(import.meta.url);
function lazy<T>(id: string): () => T {
  let f: T | undefined;
  return () => (f ??= require(id) as T);
}
const stdlibTCdf = lazy<typeof import('@stdlib/stats-base-dists-t-cdf')>('@stdlib/stats-base-dists-t-cdf');
const stdlibBetainc = lazy<typeof import('@stdlib/math-base-special-betainc')>('@stdlib/math-base-special-betainc');
const stdlibGammainc = lazy<typeof import('@stdlib/math-base-special-gammainc')>('@stdlib/math-base-special-gammainc');

/** Beyond this many degrees of freedom the t distribution is taken as the standard normal. */
const T_AS_NORMAL_DF = 1e12;

/** P(Z <= x): Phi(x) = Q(1/2, x^2/2) / 2 for x < 0 (Abramowitz and Stegun 26.2.30), each tail direct. */
export function normalCdf(x: number): number {
  if (Number.isNaN(x)) return NaN;
  if (x === -Infinity) return 0;
  if (x === Infinity) return 1;
  const half = 0.5 * gammaRegularized(0.5 * x * x, 0.5, true);
  return x < 0 ? half : 1 - half;
}

/** Upper tail P(Z > x), exact in the far tail. */
export function normalSf(x: number): number {
  return normalCdf(-x);
}

/**
 * The normal quantile: jstat's `normal.inv` (sound for p in [1e-10, 1 - 1e-10]) or, beyond, the
 * tail asymptote as a start, then Newton steps on the accurate CDF in the lower tail.
 */
export function normalQuantile(p: number): number {
  if (!(p >= 0 && p <= 1)) return NaN;
  if (p === 0) return -Infinity;
  if (p === 1) return Infinity;
  if (p === 0.5) return 0;
  const lower = p < 0.5;
  const q = lower ? p : 1 - p;
  let x: number;
  if (q >= 1e-10) x = jStat.normal.inv(q, 0, 1);
  else {
    const l = -2 * Math.log(q);
    x = -Math.sqrt(l - Math.log(l) - Math.log(2 * Math.PI));
  }
  for (let i = 0; i < 12; i++) {
    const d = normalPdf(x);
    if (!(d > 0)) break;
    const step = (normalCdf(x) - q) / d;
    x -= step;
    if (Math.abs(step) <= 1e-15 * Math.max(1, Math.abs(x))) break;
  }
  return lower ? x : -x;
}

export function normalPdf(x: number): number {
  return Math.exp(-0.5 * x * x) / Math.sqrt(2 * Math.PI);
}

/** P(T <= x) for Student's t with `df` degrees of freedom (df may be fractional, as in Welch). */
export function tCdf(x: number, df: number): number {
  if (Number.isNaN(x) || !(df > 0)) return NaN;
  if (x === Infinity) return 1;
  if (x === -Infinity) return 0;
  if (df >= T_AS_NORMAL_DF) return normalCdf(x);
  // P(T <= -|x|) = I_z(df/2, 1/2) / 2 with z = df/(df + x^2) (Abramowitz and Stegun 26.7.1);
  // 1 - z = x^2/(df + x^2) is passed exactly.
  const x2 = x * x;
  const tail = 0.5 * betaRegularized(df / (df + x2), df / 2, 0.5, false, x2 / (df + x2));
  if (Number.isNaN(tail)) return stdlibTCdf()(x, df);
  return x < 0 ? tail : 1 - tail;
}

/** Upper tail P(T > x). */
export function tSf(x: number, df: number): number {
  return tCdf(-x, df);
}

export function tPdf(x: number, df: number): number {
  if (df >= T_AS_NORMAL_DF) return normalPdf(x);
  const lg = gammaln((df + 1) / 2) - gammaln(df / 2) - 0.5 * Math.log(df * Math.PI);
  return Math.exp(lg - ((df + 1) / 2) * Math.log1p((x * x) / df));
}

/**
 * The t quantile: jstat's `studentt.inv` (measured sound for df 1 to 1e5) as a start, then Newton
 * steps on the accurate CDF so large df and far tails keep full precision.
 */
export function tQuantile(p: number, df: number): number {
  if (!(p >= 0 && p <= 1) || !(df > 0)) return NaN;
  if (p === 0) return -Infinity;
  if (p === 1) return Infinity;
  if (p === 0.5) return 0;
  if (df >= T_AS_NORMAL_DF) return normalQuantile(p);
  // Work in the lower tail for accuracy, then mirror.
  const lower = p < 0.5;
  const q = lower ? p : 1 - p;
  let x = df <= 1e5 ? jStat.studentt.inv(q, df) : normalQuantile(q);
  if (!Number.isFinite(x)) x = normalQuantile(q);
  for (let i = 0; i < 8; i++) {
    const f = tCdf(x, df);
    const d = tPdf(x, df);
    if (!(d > 0)) break;
    const step = (f - q) / d;
    x -= step;
    if (Math.abs(step) <= 1e-14 * Math.max(1, Math.abs(x))) break;
  }
  return lower ? x : -x;
}

/** Upper tail of chi-square with k degrees of freedom: the regularized upper incomplete gamma. */
export function chisqSf(x: number, k: number): number {
  if (Number.isNaN(x) || !(k > 0)) return NaN;
  if (x <= 0) return 1;
  const q = gammaRegularized(x / 2, k / 2, true);
  return Number.isNaN(q) ? stdlibGammainc()(x / 2, k / 2, true, true) : q;
}

/** Regularized incomplete beta I_x(a, b), or its complement with `upper`. */
export function betainc(x: number, a: number, b: number, upper = false): number {
  if (x <= 0) return upper ? 1 : 0;
  if (x >= 1) return upper ? 0 : 1;
  const v = betaRegularized(x, a, b, upper);
  return Number.isNaN(v) ? stdlibBetainc()(x, a, b, true, upper) : v;
}

export function gammaln(x: number): number {
  return specialGammaln(x);
}

/** P(X <= k) for X ~ Binomial(n, p), through the incomplete beta (no rounding, no summation). */
export function binomialCdf(k: number, n: number, p: number): number {
  if (k < 0) return 0;
  if (k >= n) return 1;
  return betainc(1 - p, n - k, k + 1);
}

/** P(X >= k) for X ~ Binomial(n, p). */
export function binomialSfInclusive(k: number, n: number, p: number): number {
  if (k <= 0) return 1;
  if (k > n) return 0;
  return betainc(p, k, n - k + 1);
}

/** log of the binomial coefficient C(n, k). */
export function logChoose(n: number, k: number): number {
  return gammaln(n + 1) - gammaln(k + 1) - gammaln(n - k + 1);
}
