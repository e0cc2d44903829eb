/**
 * The far upper tail of the noncentral t where its series would cancel (negative noncentrality),
 * integrated directly over the chi distribution of the denominator, and the log-space helpers it
 * shares with src/stats/noncentral-t.ts. Split from that file to keep each part readable.
 */
import { normalCdf } from './distributions.js';
import { stirlingCorrection } from './special.js';

const LN_SQRT_2PI = 0.5 * Math.log(2 * Math.PI);

/**
 * P(T' > t) for t > 0 and noncentrality -a (a > 0): the far tail, where Lenth's series would
 * cancel. Writing S = sqrt(V/df) = e^u,
 *
 *   P = integral over u of  PhiBar(t e^u + a) * g(e^u) e^u du,
 *
 * with g the density of S. The integrand is log-concave in u (log PhiBar is concave and
 * decreasing, t e^u + a is convex; the log of the chi part is df*u - df*e^{2u}/2 + const), so it
 * has one peak; we find it by safeguarded Newton steps, take its curvature as the scale, and apply
 * the trapezoid rule at a quarter of that scale until the integrand falls by e^-45 on both sides.
 * For smooth, fast-decaying integrands on the whole line the trapezoid rule converges
 * geometrically (Trefethen and Weideman 2014, SIAM Review 56, 385-458).
 */
export function smallUpperTail(t: number, df: number, a: number): number {
  const nu = df;
  const F = (u: number): number => logPhiBar(t * Math.exp(u) + a) + logScaledChiDensity(Math.exp(u), nu, u) + u;
  const dF = (u: number): number => {
    const e = Math.exp(u);
    return -t * e * hazard(t * e + a) + nu * (1 - e * e);
  };
  const d2F = (u: number): number => {
    const e = Math.exp(u);
    const z = t * e + a;
    const M = hazard(z);
    return -t * e * M + t * t * e * e * M * (z - M) - 2 * nu * e * e;
  };
  // dF(0) <= 0, dF -> nu > 0 as u -> -inf: bracket the peak in [lo, 0].
  let lo = -1;
  while (dF(lo) <= 0 && lo > -700) lo *= 2;
  let hi = 0;
  let u = 0.5 * (lo + hi);
  for (let i = 0; i < 100; i++) {
    const g = dF(u);
    if (g > 0) lo = u;
    else hi = u;
    const h2 = d2F(u);
    let next = u - g / h2;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - u) < 1e-13 * Math.max(1, Math.abs(u))) { u = next; break; }
    u = next;
  }
  const fPeak = F(u);
  const scale = 1 / Math.sqrt(-d2F(u));
  const h = scale / 4;
  let sum = 1;
  for (const dir of [1, -1]) {
    for (let k = 1; k < 100000; k++) {
      const v = F(u + dir * k * h) - fPeak;
      if (v < -45) break;
      sum += Math.exp(v);
    }
  }
  return h * sum * Math.exp(fPeak);
}

/**
 * log of the density of S = sqrt(V/df), V ~ chi-square(df):
 *   g(s) = 2 (df/2)^(df/2) / Gamma(df/2) * s^(df-1) * exp(-df s^2 / 2).
 * Written around s = 1 so that the large terms cancel analytically rather than in floating point:
 * with Stirling's series lgamma(x) = (x - 1/2) log x - x + log(2 pi)/2 + c(x),
 *   log g(s) = log 2 + log(df/2)/2 - log(2 pi)/2 - c(df/2) + df [log s - (s^2 - 1)/2] - log s,
 * and log s - (s^2 - 1)/2 = (log1p(e) - e) - e^2/2 with e = s - 1. `logS` may pass log s when known.
 */
export function logScaledChiDensity(s: number, df: number, logS = Math.log(s)): number {
  if (!(s > 0)) return -Infinity;
  const x = df / 2;
  const e = s - 1;
  const core = Math.abs(e) < 0.5 ? Math.log1p(e) - e - 0.5 * e * e : logS - 0.5 * (s * s - 1);
  return Math.log(2) + 0.5 * Math.log(x) - LN_SQRT_2PI - stirlingCorrection(x) + df * core - logS;
}

/** log of the upper normal tail, accurate for every z (continued fraction beyond z = 5). */
function logPhiBar(z: number): number {
  if (z < 5) return Math.log(normalCdf(-z));
  return -0.5 * z * z - LN_SQRT_2PI + Math.log(millsRatio(z));
}

/** phi(z) / PhiBar(z), the hazard of the standard normal. */
function hazard(z: number): number {
  if (z < 5) return Math.exp(-0.5 * z * z - LN_SQRT_2PI) / normalCdf(-z);
  return 1 / millsRatio(z);
}

/** Mills' ratio PhiBar(z) / phi(z) for z >= 5 by Lentz's continued fraction 1/(z+1/(z+2/(z+...))). */
function millsRatio(z: number): number {
  const tiny = 1e-300;
  let f = z;
  let C = z;
  let D = 0;
  for (let k = 1; k < 500; k++) {
    D = z + k * D;
    D = D === 0 ? tiny : 1 / D;
    C = z + k / C;
    if (C === 0) C = tiny;
    const delta = C * D;
    f *= delta;
    if (Math.abs(delta - 1) < 1e-16) break;
  }
  return 1 / f;
}
