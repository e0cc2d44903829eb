/**
 * Effect-size intervals: the noncentral t inversion against scipy's exact inversion (Boost's
 * noncentral t), including where tandem switches to the closed-form approximation of Abramowitz
 * and Stegun (1964, 26.7.10); the measured errors there are the ones the doc comment states.
 */
import { describe, expect, it } from 'vitest';
import { dzEffect, hedgesG, hedgesJ, standardizedInterval } from '../../src/stats/effect-size.js';
import { close, scipy, SCIPY } from './t-family-support.js';

interface NcpRecord { t: number; df: number; confidence: number; lower: number; upper: number }
const records = (scipy as unknown as { noncentralityIntervals: NcpRecord[] }).noncentralityIntervals;

/** Largest relative error allowed, by regime (exact inversion, or the approximation's measured error). */
function tolerance(r: NcpRecord): number {
  if (Math.abs(r.t) <= 100 && r.df < 1e4) return 1e-9;
  if (r.df >= 1e4 && Math.abs(r.t) <= 40) return 2e-6;
  if (r.df >= 5000) return 1e-4;
  if (r.df >= 999) return 1e-3;
  if (r.df >= 49) return 2e-2;
  return 0.2;
}

describe('noncentrality intervals against scipy', () => {
  for (const r of records) {
    it(`t = ${r.t}, df = ${r.df}, ${r.confidence * 100}%`, () => {
      const got = standardizedInterval(r.t, r.df, 1, r.confidence, 'two-sided');
      const tol = tolerance(r);
      close(got.ci[0], r.lower, tol, `lower bound vs ${SCIPY}`);
      close(got.ci[1], r.upper, tol, `upper bound vs ${SCIPY}`);
      if (tol === 1e-9) expect(got.note).toBeNull();
      else expect(got.note).toMatch(/normal approximation to the noncentral t \(Abramowitz and Stegun 1964, 26.7.10\)/);
    });
  }
  it('covers both the exact and the approximate regime', () => {
    expect(records.some((r) => tolerance(r) === 1e-9 && Math.abs(r.t) > 40)).toBe(true);
    expect(records.some((r) => r.df >= 1e4)).toBe(true);
    expect(records.some((r) => Math.abs(r.t) > 100)).toBe(true);
  });
});

describe('d_z and Hedges g shapes', () => {
  it('one-sided alternatives give one-sided bounds equal to the two-sided bound at twice the tail', () => {
    const two = standardizedInterval(2.5, 14, Math.sqrt(15), 0.9, 'two-sided');
    const g = standardizedInterval(2.5, 14, Math.sqrt(15), 0.95, 'greater');
    const l = standardizedInterval(2.5, 14, Math.sqrt(15), 0.95, 'less');
    close(g.ci[0], two.ci[0], 1e-10, 'greater lower = 90% two-sided lower');
    close(l.ci[1], two.ci[1], 1e-10, 'less upper = 90% two-sided upper');
    expect(g.ci[1]).toBe(Infinity);
    expect(l.ci[0]).toBe(-Infinity);
  });
  it('d_z scales out: the same for data in any unit', () => {
    const a = dzEffect(0.8, 1.6, 12, 0.95, 'two-sided');
    const b = dzEffect(0.8e-200, 1.6e-200, 12, 0.95, 'two-sided');
    expect(b.effect).toEqual(a.effect);
    expect(a.effect.value).toBe(0.5);
  });
  it("Hedges' g names its formula and says the interval is for delta", () => {
    const r = hedgesG({ n: 8, mean: 3, variance: 4 }, { n: 10, mean: 2, variance: 4 }, 0.95, 'two-sided');
    expect(r.effect.name).toBe("Hedges' g");
    expect(r.effect.formula).toMatch(/J x \(mean\(first\) - mean\(second\)\) \/ pooled SD/);
    close(r.effect.value, 0.5 * hedgesJ(16), 1e-14, 'g = J(16) d with d = 0.5');
    close(hedgesJ(16), 1 - 3 / 63, 1e-3, 'J(16) near 1 - 3/(4 df - 1)');
    expect(r.notes[0]).toMatch(/population standardized difference/);
  });
});
