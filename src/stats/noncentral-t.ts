/**
 * The noncentral t distribution: T' = (Z + ncp) / sqrt(V / df), Z standard normal, V chi-square
 * with df degrees of freedom (df may be fractional, as in Welch), independent.
 *
 * Method. For t >= 0 with y = t^2 / (df + t^2), Lenth (1989, Applied Statistics 38, AS 243) writes
 *
 *   P(T' <= t) = Phi(-ncp) + 1/2 * sum_m w_m * I_y((m + 1)/2, df/2),
 *   w_m = exp(-ncp^2/2) * (ncp/sqrt 2)^m / Gamma(m/2 + 1),   m = 0, 1, 2, ...
 *
 * (the even m are AS 243's Poisson weights p_j, the odd m its q_j). Because 1/2 * sum_m w_m equals
 * Phi(ncp), the upper tail has a series of its own with nothing subtracted:
 *
 *   P(T' > t) = 1/2 * sum_m w_m * I_{1-y}(df/2, (m + 1)/2).
 *
 * Following Benton and Krishnamoorthy (2003, Computational Statistics & Data Analysis 43, 249-267)
 * each series is summed outward in both directions from its largest term, not from m = 0, so that
 * exp(-ncp^2/2) never underflows (weights are formed in log space) and a noncentrality of 40 needs
 * only the few hundred terms that matter. The incomplete beta is @stdlib's (through
 * distributions.ts), accurate to near machine precision in both tails.
 *
 * Negative x: P(T' <= x; ncp) = P(T' >= -x; -ncp). With ncp >= 0 and t >= 0 both series have only
 * positive terms, so both tails keep their relative precision however small. With ncp < 0 the
 * lower tail at t >= 0 is at least 1/2 (Lenth's series, its alternating terms bounded by 1); the
 * upper tail there is 1 minus it while that leaves at least 1e-4, and otherwise it is integrated
 * directly over the chi distribution of the denominator (see `smallUpperTail`), which has only
 * positive contributions and so keeps its digits in the far tail.
 *
 * Accuracy: checked against mpmath at 25 digits (test/fixtures/mpmath-nct, 934 points, both tails)
 * for df 2 to 10,000 (fractional too), ncp -7 to 40 and x from -3 to far in the upper tail, values
 * down to 1e-290: relative error at most 1.3e-10 (df 10,000), below 1e-12 for df up to 1,000.
 * The test holds 1e-9; the requirement (issue 4) is 6 significant digits.
 *
 * Example: noncentralTSf(2.0930240544, 19, 3) = 0.81206466341633 (mpmath: 0.8120646634163271),
 * the upper-tail part of the power of a two-sided paired t at alpha 0.05 with 20 pairs and
 * d_z = 3/sqrt(20).
 */
import { betainc, gammaln, normalCdf, tCdf } from './distributions.js';
import { smallUpperTail } from './noncentral-t-tail.js';
import { logBeta } from './special.js';

/** Relative size of a neglected remainder. */
const LOG_EPS = Math.log(1e-17);
/** Above this the small tail is taken as 1 minus the big one (relative error then below ~1e-10). */
const SUBTRACT_OK = 1e-4;
const MAX_TERMS = 20000;

/** P(T' <= x) for the noncentral t with `df` > 0 degrees of freedom and noncentrality `ncp`. */
export function noncentralTCdf(x: number, df: number, ncp: number): number {
  if (Number.isNaN(x) || Number.isNaN(ncp) || !(df > 0) || !Number.isFinite(ncp)) return NaN;
  if (x < 0) return upperTail(-x, df, -ncp);
  return lowerTail(x, df, ncp);
}

/** Upper tail P(T' > x), computed directly: a small tail is never 1 minus a number close to 1. */
export function noncentralTSf(x: number, df: number, ncp: number): number {
  if (Number.isNaN(x) || Number.isNaN(ncp) || !(df > 0) || !Number.isFinite(ncp)) return NaN;
  if (x < 0) return lowerTail(-x, df, -ncp);
  return upperTail(x, df, ncp);
}

/**
 * The p-quantile, by bracketing and bisection-secant (Illinois) on the tail that is smaller at p,
 * to a relative tolerance of about 1e-12.
 */
export function noncentralTQuantile(p: number, df: number, ncp: number): number {
  if (!(p >= 0 && p <= 1) || !(df > 0) || !Number.isFinite(ncp)) return NaN;
  if (p === 0) return -Infinity;
  if (p === 1) return Infinity;
  const lowerSide = p <= 0.5;
  // g(x) increasing in x, zero at the quantile.
  const g = (x: number): number => (lowerSide ? noncentralTCdf(x, df, ncp) - p : (1 - p) - noncentralTSf(x, df, ncp));
  let step = 1 + Math.abs(ncp) * 0.5;
  let lo = ncp - step;
  let hi = ncp + step;
  while (g(lo) > 0) { hi = lo; step *= 2; lo = ncp - step; if (step > 1e300) return -Infinity; }
  while (g(hi) < 0) { lo = hi; step *= 2; hi = ncp + step; if (step > 1e300) return Infinity; }
  let glo = g(lo);
  let ghi = g(hi);
  let side = 0;
  for (let i = 0; i < 200; i++) {
    let mid = (lo * ghi - hi * glo) / (ghi - glo);
    if (!Number.isFinite(mid) || mid <= lo || mid >= hi) mid = 0.5 * (lo + hi);
    const gm = g(mid);
    if (gm === 0) return mid;
    if (gm < 0) { lo = mid; glo = gm; if (side === -1) ghi /= 2; side = -1; }
    else { hi = mid; ghi = gm; if (side === 1) glo /= 2; side = 1; }
    if (hi - lo <= 1e-12 * Math.max(1, Math.abs(mid))) break;
  }
  return 0.5 * (lo + hi);
}

/** P(T' <= t) for t >= 0. */
function lowerTail(t: number, df: number, d: number): number {
  if (t === Infinity) return 1;
  if (d === 0) return tCdf(t, df);
  if (df === Infinity) return normalCdf(t - d);
  if (t === 0) return normalCdf(-d);
  const s = lenthSum(d, t, df, 'lower');
  return Math.min(1, Math.max(0, normalCdf(-d) + 0.5 * s));
}

/** P(T' > t) for t >= 0. */
function upperTail(t: number, df: number, d: number): number {
  if (t === Infinity) return 0;
  if (d === 0) return tCdf(-t, df);
  if (df === Infinity) return normalCdf(d - t);
  if (t === 0) return normalCdf(d);
  if (d > 0) return Math.min(1, Math.max(0, 0.5 * lenthSum(d, t, df, 'upper')));
  const viaBig = 1 - lowerTail(t, df, d);
  if (viaBig >= SUBTRACT_OK) return viaBig;
  return smallUpperTail(t, df, -d);
}

/**
 * sum_m sign_m |w_m| V_m with V_m = I_y((m+1)/2, df/2) ('lower') or its complement ('upper').
 *
 * The even and odd m form two sequences in a = (m+1)/2 + j, j = 0, 1, ... Each starts at the mode
 * of the weights (m near ncp^2, Benton and Krishnamoorthy 2003) with one direct incomplete beta,
 * then moves by the recurrence I_y(a+1, b) = I_y(a, b) - T(a), T(a) = y^a (1-y)^b / (a B(a, b)),
 * T(a+1) = T(a) y (a+b)/(a+1). Toward the largest term (downward for 'lower', upward for 'upper')
 * the recurrence only adds, which is stable; it is kept in scaled form so tiny tails do not
 * underflow. Away from it the recurrence subtracts, so the value is recomputed directly whenever
 * it has fallen a thousandfold since the last direct value. Each direction stops when the terms
 * have passed their peak and the rest, bounded by a geometric series (the terms are log-concave),
 * is below 1e-17 of the largest term.
 */
function lenthSum(d: number, t: number, df: number, kind: 'lower' | 'upper'): number {
  // y = t^2/(df + t^2) and 1 - y, and their logs, each formed without cancellation or overflow
  // (for t >> df, y rounds to 1 and only 1 - y = r/(1+r) with r = df/t^2 keeps its digits).
  const r = t > 1 ? df / t / t : (t * t) / df;
  const geo: Geometry =
    t > 1
      ? { y: 1 / (1 + r), yc: r / (1 + r), logy: -Math.log1p(r), logyc: Math.log(r) - Math.log1p(r) }
      : { y: r / (1 + r), yc: 1 / (1 + r), logy: Math.log(r) - Math.log1p(r), logyc: -Math.log1p(r) };
  const b = df / 2;
  const lam = 0.5 * d * d;
  const k = Math.floor(d * d);
  let total = 0;
  for (const q of [0, 1]) {
    const part = paritySum(q, Math.max(0, Math.round((k - q) / 2)), lam, geo, b, kind);
    total += d < 0 && q === 1 ? -part : part;
  }
  return total;
}

interface Geometry { y: number; yc: number; logy: number; logyc: number }

function paritySum(q: number, j0: number, lam: number, geo: Geometry, b: number, kind: 'lower' | 'upper'): number {
  const { y, yc, logy, logyc } = geo;
  const logLam = Math.log(lam);
  const a0 = (q + 1) / 2 + j0;
  const m0 = q + 2 * j0;
  // log |w_m| = -lam + (m/2) log lam - lgamma(m/2 + 1)
  const logW0 = -lam + (m0 / 2) * logLam - gammaln(m0 / 2 + 1);
  // T(a) = y^a (1-y)^b / (a B(a, b)), with log B free of large cancelling terms.
  const logT0 = a0 * logy + b * logyc - Math.log(a0) - logBeta(a0, b);
  // The complement as I_{1-y}(b, a), handing the incomplete beta the small argument it needs.
  const direct = (a: number): number => (kind === 'upper' ? betainc(yc, b, a) : betainc(y, a, b));
  const v0 = direct(a0);
  const stableDir = kind === 'lower' ? -1 : 1;
  let sum = 0;
  let maxLog = -Infinity;

  /** Adds one term (given by its log); returns true when this direction may stop. */
  const stopper = (seedLog: number): ((logTerm: number) => boolean) => {
    let prevLog = seedLog;
    return (logTerm: number): boolean => {
      if (logTerm > -745) sum += Math.exp(logTerm);
      if (logTerm > maxLog) maxLog = logTerm;
      const falling = logTerm < prevLog;
      const r = Math.exp(logTerm - prevLog);
      prevLog = logTerm;
      if (!falling) return false;
      if (logTerm === -Infinity) return true;
      return r < 1 && logTerm + Math.log(r / (1 - r)) - maxLog < LOG_EPS;
    };
  };

  // The seed term.
  let seedLog: number;
  {
    // Scaled value for the stable walk: V = v * e^S.
    let S: number;
    let v: number;
    if (v0 > 1e-290) {
      S = Math.log(v0);
      v = 1;
    } else {
      // Underflowed seed: V is at least T and is about T/(1 - r) when the ratio r is below 1;
      // every term near here is negligible, so this estimate only needs the right magnitude.
      S = logT0;
      const r = kind === 'lower' ? Math.exp(logy + Math.log(a0 + b) - Math.log(a0 + 1)) : 0;
      v = r < 0.9 ? 1 / (1 - r) : 1;
    }
    seedLog = logW0 + S + Math.log(v);
    sum += Math.exp(seedLog);
    maxLog = seedLog;
    const stopS = stopper(seedLog);
    // Stable walk.
    let logW = logW0;
    let logT = logT0;
    let a = a0;
    let m = m0;
    for (let step = 0; step < MAX_TERMS; step++) {
      if (stableDir === -1) {
        if (a - 1 < 0.5) break;
        // T(a-1) = T(a) * a / (y (a - 1 + b)); V(a-1) = V(a) + T(a-1)
        logT += Math.log(a) - logy - Math.log(a - 1 + b);
        a -= 1;
        logW += -logLam + Math.log(m / 2);
        m -= 2;
        v += Math.exp(logT - S);
      } else {
        // V(a+1) = V(a) + T(a); T(a+1) = T(a) * y (a + b)/(a + 1)
        v += Math.exp(logT - S);
        logT += logy + Math.log(a + b) - Math.log(a + 1);
        a += 1;
        m += 2;
        logW += logLam - Math.log(m / 2);
      }
      if (v > 1e250) { v /= 1e250; S += 575.6462732485114; } // ln(1e250)
      if (stopS(logW + S + Math.log(v))) break;
    }
  }
  if (v0 > 1e-290) {
    // Unstable walk, away from the peak: both factors fall, so few steps are needed.
    const stopU = stopper(seedLog);
    let V = v0;
    let Vseed = v0;
    let logW = logW0;
    let logT = logT0;
    let a = a0;
    let m = m0;
    for (let step = 0; step < MAX_TERMS; step++) {
      if (stableDir === -1) {
        // upward: V(a+1) = V(a) - T(a)
        V -= Math.exp(logT);
        logT += logy + Math.log(a + b) - Math.log(a + 1);
        a += 1;
        m += 2;
        logW += logLam - Math.log(m / 2);
      } else {
        if (a - 1 < 0.5) break;
        // downward: V(a-1) = V(a) - T(a-1)
        logT += Math.log(a) - logy - Math.log(a - 1 + b);
        a -= 1;
        logW += -logLam + Math.log(m / 2);
        m -= 2;
        V -= Math.exp(logT);
      }
      if (!(V > 1e-3 * Vseed)) {
        V = direct(a);
        Vseed = V;
      }
      if (stopU(V > 0 ? logW + Math.log(V) : -Infinity)) break;
    }
  }
  return sum;
}

