/**
 * Shapiro-Wilk W test of normality by Royston's algorithm AS R94 (Royston 1995, "Remark AS R94: a
 * remark on algorithm AS 181: the W-test for normality", Applied Statistics 44:547-551; the test
 * itself: Shapiro and Wilk 1965, Biometrika 52:591-611), for 3 <= n <= 5000.
 *
 * W = (sum a_i x_(i))^2 / sum (x_i - mean)^2 with the ordered sample x_(i) and coefficients a_i
 * approximating the normalised expected normal order statistics: with m_i = Phi^-1((i - 3/8) /
 * (n + 1/4)) and u = 1/sqrt(n), the two outermost coefficients are polynomials in u, the rest
 * m_i scaled so that sum a_i^2 = 1. W is computed as 1 - (1 - r^2) from the correlation of a and x,
 * which keeps its digits near 1.
 * p-value: for n = 3 exact, p = (6/pi)(asin(sqrt(W)) - asin(sqrt(3/4))); for 4 <= n <= 11,
 * -log(gamma - log(1 - W)) with gamma = 0.459 n - 2.273 is normal with mean and log-SD cubic in n;
 * for n >= 12, log(1 - W) is normal with mean cubic and log-SD quadratic in log n. Upper tail.
 * Computed in double precision here (scipy 1.10 runs the original single-precision Fortran, so the
 * two agree to about 6 digits in W and somewhat less in small p-values).
 *
 * Example (Shapiro and Wilk 1965, section 5, weights of 11 men in pounds, from memory): 148, 154,
 * 158, 160, 161, 162, 166, 170, 182, 195, 236 give W = 0.79 (their exact coefficients); AS R94's
 * approximate coefficients give W = 0.7888, p = 0.0067 (scipy 1.10 agrees).
 */
import { normalQuantile, normalSf } from './distributions.js';

const C1 = [0, 0.221157, -0.147981, -2.07119, 4.434685, -2.706056];
const C2 = [0, 0.042981, -0.293762, -1.752461, 5.682633, -3.582633];
const C3 = [0.544, -0.39978, 0.025054, -6.714e-4];
const C4 = [1.3822, -0.77857, 0.062767, -0.0020322];
const C5 = [-1.5861, -0.31082, -0.083751, 0.0038915];
const C6 = [-0.4803, -0.082676, 0.0030302];
const G = [-2.273, 0.459];

export const SHAPIRO_MIN = 3;
export const SHAPIRO_MAX = 5000;

/** W and its p-value for an ascending sample with 3 <= n <= 5000 and positive range. */
export function shapiroWilk(sorted: ArrayLike<number>): { w: number; pValue: number } {
  const n = sorted.length;
  if (n < SHAPIRO_MIN || n > SHAPIRO_MAX) throw new RangeError(`Shapiro-Wilk needs 3 to 5000 values, got ${n}`);
  const range = sorted[n - 1] - sorted[0];
  if (!(range > 0)) throw new RangeError('Shapiro-Wilk needs values that are not all equal');
  const a = coefficients(n);
  const w = statistic(sorted, a, range);
  return { w, pValue: shapiroPValue(w, n) };
}

/** The half-vector of coefficients a_1 >= a_2 >= ... (for the lowest order statistics, sign +). */
function coefficients(n: number): Float64Array {
  const half = Math.floor(n / 2);
  const a = new Float64Array(half);
  if (n === 3) {
    a[0] = Math.SQRT1_2;
    return a;
  }
  const m = new Float64Array(half);
  let summ2 = 0;
  for (let i = 0; i < half; i++) {
    m[i] = normalQuantile((i + 1 - 0.375) / (n + 0.25));
    summ2 += m[i] * m[i];
  }
  summ2 *= 2;
  const ssumm2 = Math.sqrt(summ2);
  const rsn = 1 / Math.sqrt(n);
  const a1 = poly(C1, rsn) - m[0] / ssumm2;
  let start: number;
  let fac: number;
  if (n > 5) {
    start = 2;
    const a2 = -m[1] / ssumm2 + poly(C2, rsn);
    fac = Math.sqrt((summ2 - 2 * m[0] * m[0] - 2 * m[1] * m[1]) / (1 - 2 * a1 * a1 - 2 * a2 * a2));
    a[1] = a2;
  } else {
    start = 1;
    fac = Math.sqrt((summ2 - 2 * m[0] * m[0]) / (1 - 2 * a1 * a1));
  }
  a[0] = a1;
  for (let i = start; i < half; i++) a[i] = -m[i] / fac;
  return a;
}

/** W as 1 - (1 - r^2), r the correlation of the full antisymmetric coefficient vector with x. */
function statistic(x: ArrayLike<number>, a: Float64Array, range: number): number {
  const n = x.length;
  // Full coefficient of the i-th order statistic: -a for the lower half, +a for the upper, 0 in the middle.
  const coef = (i: number): number => {
    const j = n - 1 - i;
    if (i === j) return 0;
    return i < j ? -a[i] : a[j];
  };
  let sa = 0;
  let sx = 0;
  for (let i = 0; i < n; i++) {
    sa += coef(i);
    sx += x[i] / range;
  }
  sa /= n;
  sx /= n;
  let ssa = 0;
  let ssx = 0;
  let sax = 0;
  for (let i = 0; i < n; i++) {
    const da = coef(i) - sa;
    const dx = x[i] / range - sx;
    ssa += da * da;
    ssx += dx * dx;
    sax += da * dx;
  }
  const root = Math.sqrt(ssa * ssx);
  const w1 = ((root - sax) * (root + sax)) / (ssa * ssx);
  return Math.min(1, Math.max(0, 1 - w1));
}

/** Royston's p-value for a given W and sample size n (3..5000). */
export function shapiroPValue(w: number, n: number): number {
  if (n === 3) {
    const p = (6 / Math.PI) * (Math.asin(Math.sqrt(w)) - Math.asin(Math.sqrt(0.75)));
    return Math.min(1, Math.max(0, p));
  }
  const w1 = Math.log(1 - w);
  if (w1 === -Infinity) return 1;
  if (n <= 11) {
    const gamma = poly(G, n);
    // W so small that the transformation is undefined: the p-value is below anything the
    // approximation can express (AS R94 returns a tiny placeholder); report 0.
    if (w1 >= gamma) return 0;
    const y = -Math.log(gamma - w1);
    return normalSf((y - poly(C3, n)) / Math.exp(poly(C4, n)));
  }
  const ln = Math.log(n);
  return normalSf((w1 - poly(C5, ln)) / Math.exp(poly(C6, ln)));
}

/** c[0] + c[1] x + c[2] x^2 + ... */
function poly(c: number[], x: number): number {
  let r = 0;
  for (let i = c.length - 1; i >= 0; i--) r = r * x + c[i];
  return r;
}
