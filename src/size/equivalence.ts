/**
 * Exact power of the two one-sided tests (TOST) for equivalence of two means.
 *
 * Equivalence is shown when both one-sided tests at level alpha reject (Schuirmann 1987, Journal of
 * Pharmacokinetics and Biopharmaceutics 15, 657-680), that is when the 1 - 2*alpha confidence
 * interval for the difference lies inside (-margin, +margin):
 *   (D + margin)/SE-hat > c  and  (D - margin)/SE-hat < -c,   c = t(1 - alpha, df).
 * With D ~ N(delta, SE^2) and SE-hat = SE * S, S = sqrt(V/df), V ~ chi-square(df) independent of D,
 * condition on S = s: the estimate must fall in (-margin + c*SE*s, margin - c*SE*s), so
 *   power = integral_0^{s_max} [ Phi(A - c s) - Phi(B + c s) ] g(s) ds,
 *   A = (margin - delta)/SE,  B = (-margin - delta)/SE,  s_max = margin / (c * SE),
 * with g the density of S. This is the exact power (Owen 1965, Biometrika 52, 437-446; Phillips
 * 1990, Journal of Pharmacokinetics and Biopharmaceutics 18, 137-144, who writes it with Owen's Q);
 * here the integral is taken numerically by adaptive Gauss-Legendre quadrature over panels sized to
 * the spread of g. For two groups with unequal spreads SE-hat is only approximately a scaled chi
 * (Welch-Satterthwaite df at the planned sizes), so that case is an approximation.
 *
 * Example: 20 pairs, sdDiff 1, margin 0.6, true difference 0, alpha 0.05: SE = 0.2236, df = 19,
 * c = 1.7291, power = 0.6533 (test/fixtures/size-power checks such values against mpmath and a
 * simulation).
 */
import { normalCdf } from '../stats/distributions.js';
import { logScaledChiDensity } from '../stats/noncentral-t-tail.js';
import { integrate } from './quadrature.js';

export function tostPower(se: number, df: number, delta: number, margin: number, c: number): number {
  const A = (margin - delta) / se;
  const B = (-margin - delta) / se;
  const sMax = margin / (c * se);
  const nu = df;
  const logG = (s: number): number => logScaledChiDensity(s, nu);
  const f = (s: number): number => {
    if (s <= 0) return 0;
    const inside = normalCdf(A - c * s) - normalCdf(B + c * s);
    return inside > 0 ? inside * Math.exp(logG(s)) : 0;
  };
  // Where g lives: from its mode out to where it has fallen by e^-60 on each side.
  const mode = nu > 1 ? Math.sqrt((nu - 1) / nu) : 0;
  const peakLog = logG(Math.max(mode, 1e-300));
  const rel = (s: number): number => (s <= 0 ? -Infinity : logG(s) - peakLog);
  const scale = 1 / Math.sqrt(2 * nu);
  let lo = mode;
  if (nu > 1) {
    let step = scale;
    while (lo > 0 && rel(lo) > -60) { lo = Math.max(0, lo - step); step *= 1.5; }
  }
  let hi = Math.max(mode, scale);
  let step = scale;
  while (rel(hi) > -60) { hi += step; step *= 1.5; }
  const top = Math.min(hi, sMax);
  if (!(top > lo)) return 0;
  const panels = Math.min(400, Math.max(8, Math.ceil((top - lo) / scale) * 2));
  const width = (top - lo) / panels;
  let total = 0;
  for (let i = 0; i < panels; i++) total += integrate(f, lo + i * width, lo + (i + 1) * width, 1e-14);
  return Math.min(1, Math.max(0, total));
}
