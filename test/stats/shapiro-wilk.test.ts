import { describe, expect, it } from 'vitest';
import { shapiroPValue, shapiroWilk } from '../../src/stats/shapiro-wilk.js';
import { expectClose, loadFixture } from '../fixtures/scipy-rank/load.js';

interface ShapiroCase {
  name: string;
  values: number[];
  w: number;
  pValue: number;
}

const sorted = (v: number[]): Float64Array => Float64Array.from(v).sort();

describe('Shapiro-Wilk against scipy.stats.shapiro (test/fixtures/scipy-rank/shapiro.json)', () => {
  // scipy 1.10 runs AS R94 in single precision (float32 Fortran), so its W carries about 7 digits
  // and its p inherits W's rounding (up to 2e-3 relative for n >= 1000, where 1 - W is small).
  // The tests therefore compare W at single-precision level, and check the p-value formula by
  // feeding scipy's own W into it, which removes W's rounding from the comparison.
  const fx = loadFixture<ShapiroCase>('shapiro.json');
  for (const c of fx.cases) {
    it(`${c.name}: W`, () => {
      const r = shapiroWilk(sorted(c.values));
      expectClose(r.w, c.w, 5e-6, `${c.name}: W`);
    });
    it(`${c.name}: p-value formula at scipy's W`, () => {
      const n = c.values.length;
      if (c.pValue === 0) {
        // Below float32's range in scipy; the double-precision value must be tiny too.
        expect(shapiroWilk(sorted(c.values)).pValue).toBeLessThan(1e-30);
        return;
      }
      // scipy's W is a float32: the true W lies within one float32 unit (2^-24) of it, which
      // matters near W = 1 where 1 - W is small. scipy's p must lie within the range of p over
      // that interval, widened by float32's own log / normal-tail rounding (2e-5, 1e-4 far out).
      const ulp = 2 ** -24;
      const pa = shapiroPValue(c.w - ulp, n);
      const pb = shapiroPValue(c.w + ulp, n);
      const lo = Math.min(pa, pb);
      const hi = Math.max(pa, pb);
      const slack = c.pValue > 1e-10 ? 2e-5 : 1e-4;
      const inside = c.pValue >= lo * (1 - slack) && c.pValue <= hi * (1 + slack);
      expect(inside, `${c.name}: scipy p ${c.pValue} outside [${lo}, ${hi}] (p at W -/+ one float32 unit), slack ${slack}`).toBe(true);
      // And at scipy's W itself, 6 significant digits wherever W's rounding cannot move them.
      if ((hi - lo) / c.pValue < 1e-7) expectClose(shapiroPValue(c.w, n), c.pValue, 2e-5, `${c.name}: p at W = ${c.w}`);
    });
  }
});

describe('Shapiro-Wilk published and exact checks', () => {
  it('Shapiro and Wilk (1965), weights of 11 men (from memory): W = 0.79, significant at 1%', () => {
    const r = shapiroWilk(sorted([148, 154, 158, 160, 161, 162, 166, 170, 182, 195, 236]));
    // Their exact coefficients give 0.79; Royston's approximate coefficients agree to 2 decimals.
    expect(r.w.toFixed(2)).toBe('0.79');
    expect(r.pValue).toBeLessThan(0.01);
  });
  it('n = 3: W and p in closed form (Shapiro and Wilk 1965: a = (-1/sqrt 2, 0, 1/sqrt 2), p = (6/pi)(asin sqrt W - asin sqrt(3/4)))', () => {
    // 1, 2, 4: (x3 - x1)^2 / 2 = 4.5, sum of squares 42/9, W = 40.5 / 42.
    const r = shapiroWilk(sorted([4, 1, 2]));
    expectClose(r.w, 40.5 / 42, 1e-14, 'W');
    expectClose(r.pValue, (6 / Math.PI) * (Math.asin(Math.sqrt(40.5 / 42)) - Math.PI / 3), 1e-13, 'p');
    // Equally spaced values have W = 1 and p = 1.
    expect(shapiroWilk(sorted([1, 2, 3])).pValue).toBeCloseTo(1, 12);
  });
  it('W is invariant to location and scale (power-of-two scaling is exact)', () => {
    const x = [3.1, 4.7, 2.2, 5.9, 4.4, 3.8, 6.1, 2.9];
    const a = shapiroWilk(sorted(x));
    const b = shapiroWilk(sorted(x.map((v) => v * 1024 - 1e6)));
    expectClose(b.w, a.w, 1e-9, 'W after shift and scale');
  });
  it('refuses n outside 3..5000 and constant data (the diagnostics layer reports why)', () => {
    expect(() => shapiroWilk(sorted([1, 2]))).toThrow(RangeError);
    expect(() => shapiroWilk(new Float64Array(5001).map((_, i) => i))).toThrow(RangeError);
    expect(() => shapiroWilk(sorted([2, 2, 2, 2]))).toThrow(RangeError);
  });
});
