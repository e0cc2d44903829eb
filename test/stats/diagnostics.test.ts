import { describe, expect, it } from 'vitest';
import { describeSample, quantile7 } from '../../src/stats/diagnostics.js';
import { expectClose, loadFixture } from '../fixtures/scipy-rank/load.js';

interface DiagnosticsCase {
  name: string;
  values: number[];
  mean: number;
  sd: number;
  median: number;
  q1: number;
  q3: number;
  min: number;
  max: number;
  skewness: number | null;
  outliersLow: number;
  outliersHigh: number;
  zeros: number;
  tiedValues: number;
}

describe('describeSample against numpy and scipy (test/fixtures/scipy-rank/diagnostics.json)', () => {
  const fx = loadFixture<DiagnosticsCase>('diagnostics.json');
  for (const c of fx.cases) {
    it(c.name, () => {
      const d = describeSample(c.name, c.values);
      expect(d.n).toBe(c.values.length);
      expectClose(d.mean, c.mean, 1e-13, `${c.name}: mean`, 1e-15);
      expectClose(d.sd, c.sd, 1e-12, `${c.name}: sd`);
      expectClose(d.median, c.median, 1e-14, `${c.name}: median`, 1e-15);
      expectClose(d.q1, c.q1, 1e-14, `${c.name}: q1 (type 7)`, 1e-15);
      expectClose(d.q3, c.q3, 1e-14, `${c.name}: q3 (type 7)`, 1e-15);
      expect(d.min).toBe(c.min);
      expect(d.max).toBe(c.max);
      if (c.skewness === null) expect(d.skewness).toBeNull();
      else expectClose(d.skewness!, c.skewness, 1e-10, `${c.name}: skewness G1`);
      expect(d.outliers.low).toBe(c.outliersLow);
      expect(d.outliers.high).toBe(c.outliersHigh);
      expect(d.outliers.count).toBe(c.outliersLow + c.outliersHigh);
      expect(d.zeros).toBe(c.zeros);
      expect(d.tiedValues).toBe(c.tiedValues);
    });
  }
});

describe('describeSample behaviour and edge cases', () => {
  it('Hyndman and Fan type 7 on 1..4: quartiles 1.75 and 3.25 (their Table / R default)', () => {
    expect(quantile7([1, 2, 3, 4], 0.25)).toBe(1.75);
    expect(quantile7([1, 2, 3, 4], 0.75)).toBe(3.25);
  });
  it('fewer than 2 values, NaN, Infinity', () => {
    expect(() => describeSample('differences', [3])).toThrowError(expect.objectContaining({ code: 'too-few' }));
    expect(() => describeSample('differences', [1, NaN, 2])).toThrowError(/value #2 is NaN/);
    expect(() => describeSample('differences', [1, 2, -Infinity])).toThrowError(expect.objectContaining({ code: 'not-finite' }));
  });
  it('no variation: skewness and Shapiro-Wilk null, with the reason', () => {
    const d = describeSample('differences', [0, 0, 0, 0, 0]);
    expect(d.skewness).toBeNull();
    expect(d.shapiro).toBeNull();
    expect(d.shapiroNote).toMatch(/all values are equal/);
    expect(d.zeros).toBe(5);
    expect(d.tiedValues).toBe(5);
    expect(d.sd).toBe(0);
  });
  it('Shapiro-Wilk only for 3..5000 values, with a note otherwise', () => {
    expect(describeSample('g', [1, 2]).shapiroNote).toMatch(/at least 3/);
    const big = Array.from({ length: 6000 }, (_, i) => Math.sin(i) * 10);
    const d = describeSample('g', big);
    expect(d.shapiro).toBeNull();
    expect(d.shapiroNote).toMatch(/3 to 5000/);
  });
  it('outlier list capped at 20, farthest first chosen, shown ascending; count complete', () => {
    const values = [...Array.from({ length: 100 }, (_, i) => (i % 10) + 45), ...Array.from({ length: 30 }, (_, i) => 200 + i), -500];
    const d = describeSample('kiln delays', values);
    expect(d.outliers.count).toBe(31);
    expect(d.outliers.values.length).toBe(20);
    expect(d.outliers.values[0]).toBe(-500);
    expect(d.outliers.values[19]).toBe(229);
    expect([...d.outliers.values].sort((a, b) => a - b)).toEqual(d.outliers.values);
  });
  it('enormous values: no overflow in mean, sd or skewness', () => {
    const d = describeSample('g', [1e308, 1.7e308, -1.7e308, 0.5e308]);
    expectClose(d.mean, 0.375e308, 1e-12, 'mean');
    expect(Number.isFinite(d.sd)).toBe(true);
    expect(d.skewness).not.toBeNull();
  });
  it('1,000,000 values are described (one sort)', () => {
    const values = Array.from({ length: 1_000_000 }, (_, i) => ((i * 7919) % 10007) / 100);
    const d = describeSample('differences', values);
    expect(d.n).toBe(1_000_000);
    expect(d.min).toBe(0);
    expect(d.shapiro).toBeNull();
    expect(d.tiedValues).toBe(1_000_000);
  });
});
