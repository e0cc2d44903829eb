import { describe, expect, it } from 'vitest';
import { runProcedure } from '../../src/stats/index.js';
import { rankSum } from '../../src/stats/rank-sum.js';
import { DEFAULT_OPTIONS } from '../../src/stats/types.js';

// Invented kiln-firing crossover: each tile batch fired under both schedules, order by sequence.
const input = {
  kind: 'crossover' as const,
  firstThenSecond: { period1: [12, 14, 11, 13], period2: [10, 11, 10, 12.5] },
  secondThenFirst: { period1: [9, 10, 11, 10.5], period2: [12, 12, 14, 11] },
};

describe('rank-sum on crossover data (Koch 1972)', () => {
  it('is the rank-sum test on the half period differences between sequences', () => {
    const r = runProcedure('rank-sum', input);
    const direct = rankSum([1, 1.5, 0.5, 0.25], [-1.5, -1, -1.5, -0.25], DEFAULT_OPTIONS);
    expect(r.statistic).toBe(direct.statistic);
    expect(r.pValue).toBe(direct.pValue);
    expect(r.estimate).toBe(direct.estimate);
    expect(r.method).toMatch(/half period differences/);
  });
  it('estimates the treatment effect free of a period effect: adding a constant to every period 1 value changes nothing', () => {
    const shifted = {
      ...input,
      firstThenSecond: { ...input.firstThenSecond, period1: input.firstThenSecond.period1.map((v) => v + 3) },
      secondThenFirst: { ...input.secondThenFirst, period1: input.secondThenFirst.period1.map((v) => v + 3) },
    };
    const a = runProcedure('rank-sum', input);
    const b = runProcedure('rank-sum', shifted);
    expect(b.estimate).toBeCloseTo(a.estimate, 12);
    expect(b.pValue).toBeCloseTo(a.pValue, 12);
  });
  it('a missing value names the sequence and period; 1e308-sized values do not overflow the half differences', () => {
    const broken = { ...input, secondThenFirst: { ...input.secondThenFirst, period2: [12, NaN, 14, 11] } };
    expect(() => runProcedure('rank-sum', broken)).toThrow(/crossover rank-sum, secondThenFirst period 2: value #2 is NaN/);
    const k = 1e308;
    const big = {
      kind: 'crossover' as const,
      // Half differences 1.5, 1.4, 1.6 and 1.0, 1.1, 0.9 (x 1e308); period 1 - period 2 itself overflows.
      firstThenSecond: { period1: [1.5, 1.4, 1.6].map((v) => v * k), period2: [-1.5, -1.4, -1.6].map((v) => v * k) },
      secondThenFirst: { period1: [1.0, 1.1, 0.9].map((v) => v * k), period2: [-1.0, -1.1, -0.9].map((v) => v * k) },
    };
    const r = runProcedure('rank-sum', big);
    expect(r.statistic).toBe(9);
    expect(r.estimate / k).toBeCloseTo(0.5, 12);
  });
  it('other procedures refuse crossover data with the ones that take it named', () => {
    expect(() => runProcedure('welch-t', input)).toThrow(/crossover-t and rank-sum/);
  });
});
