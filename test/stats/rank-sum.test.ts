import { describe, expect, it } from 'vitest';
import { rankSumCounts, tailsOf } from '../../src/stats/rank-exact.js';
import { rankSum } from '../../src/stats/rank-sum.js';
import { superiorityInterval } from '../../src/stats/rank-superiority.js';
import type { Alternative, ProcedureOptions } from '../../src/stats/types.js';
import { expectClose, loadFixture } from '../fixtures/scipy-rank/load.js';

interface MwuCase {
  name: string;
  first: number[];
  second: number[];
  alternative: Alternative;
  method: 'exact' | 'normal';
  correction: boolean;
  confidence: number;
  u: number;
  pValue: number;
  estimate: number;
  ciRank: number;
  ci: [number | null, number | null];
  superiority: number;
  superiorityCi: [number, number];
}

const opts = (o: Partial<ProcedureOptions> = {}): ProcedureOptions => ({ alternative: 'two-sided', confidence: 0.95, nullValue: 0, ...o });

describe('rank-sum against scipy.stats.mannwhitneyu (test/fixtures/scipy-rank/mannwhitneyu.json)', () => {
  const fx = loadFixture<MwuCase>('mannwhitneyu.json');
  it('fixture records the library version', () => {
    expect(fx.meta.scipy).toMatch(/^\d+\.\d+/);
  });
  for (const c of fx.cases) {
    it(`${c.name}, ${c.alternative}`, () => {
      const r = rankSum(c.first, c.second, opts({ alternative: c.alternative, confidence: c.confidence, method: c.method, correction: c.correction }));
      const label = `${c.name} ${c.alternative}`;
      expect(r.statistic, `${label}: U`).toBe(c.u);
      expectClose(r.pValue, c.pValue, 1e-9, `${label}: p-value`);
      // Hodges-Lehmann shift and interval against all pairwise differences sorted by numpy.
      expectClose(r.estimate, c.estimate, 1e-12, `${label}: estimate`, 1e-12);
      expectClose(r.ci[0], c.ci[0], 1e-12, `${label}: lower end`, 1e-12);
      expectClose(r.ci[1], c.ci[1], 1e-12, `${label}: upper end`, 1e-12);
      // Probability of superiority; its Newcombe (2006) interval against numpy's quartic roots.
      expectClose(r.effectSize!.value, c.superiority, 1e-14, `${label}: probability of superiority`);
      expectClose(r.effectSize!.ci![0], c.superiorityCi[0], 1e-9, `${label}: superiority lower`, 1e-12);
      expectClose(r.effectSize!.ci![1], c.superiorityCi[1], 1e-9, `${label}: superiority upper`, 1e-12);
    });
  }
});

describe('rank-sum against published tables', () => {
  it('two-sided 5% critical values of U for equal groups (handbook table of the Mann-Whitney test; from memory)', () => {
    // Largest U with P(U <= U_crit) <= 0.025.
    const table: Record<number, number> = { 5: 2, 6: 5, 7: 8, 8: 13, 9: 17, 10: 23, 20: 127 };
    for (const [nText, crit] of Object.entries(table)) {
      const n = Number(nText);
      const counts = rankSumCounts(n, n);
      expect(tailsOf(counts, crit).lower, `n = ${n}: P(U <= ${crit})`).toBeLessThanOrEqual(0.025);
      expect(tailsOf(counts, crit + 1).lower, `n = ${n}: P(U <= ${crit + 1})`).toBeGreaterThan(0.025);
    }
  });
  it('exact distribution sums to C(N, m) and is the same for (m, n) and (n, m)', () => {
    const a = rankSumCounts(4, 7);
    const b = rankSumCounts(7, 4);
    expect(Array.from(a)).toEqual(Array.from(b));
    expect(a.reduce((s, v) => s + v, 0)).toBe(330);
  });
});

describe('rank-sum behaviour and edge cases', () => {
  it('describes itself as a test of stochastic superiority, not of medians', () => {
    const r = rankSum([3, 5, 8, 9], [1, 2, 4], opts());
    expect(r.notes[0]).toMatch(/stochastic superiority/);
    expect(r.notes[0]).toMatch(/not whether the medians differ/);
  });
  it('empty group, NaN, Infinity', () => {
    expect(() => rankSum([], [1, 2], opts())).toThrowError(expect.objectContaining({ code: 'too-few' }));
    expect(() => rankSum([1, 2], [3, NaN], opts())).toThrowError(/second group: value #2 is NaN/);
    expect(() => rankSum([-Infinity], [3], opts())).toThrowError(expect.objectContaining({ code: 'not-finite' }));
  });
  it('all values equal in both groups: explicit no-variation error', () => {
    expect(() => rankSum([4, 4, 4], [4, 4], opts())).toThrowError(/ranks carry no information/);
  });
  it('a null shift is applied to the first group before ranking', () => {
    const first = [12, 15, 11, 14, 13];
    const second = [9, 10, 8, 11, 7];
    const shifted = rankSum(first, second, opts({ nullValue: 3 }));
    const manual = rankSum(first.map((v) => v - 3), second, opts());
    expect(shifted.statistic).toBe(manual.statistic);
    expect(shifted.pValue).toBe(manual.pValue);
    // The estimate stays on the data's scale.
    expect(shifted.estimate).toBe(manual.estimate + 3);
  });
  it('one value per group works (exact, widest interval)', () => {
    const r = rankSum([5], [3], opts());
    expect(r.statistic).toBe(1);
    expect(r.pValue).toBe(1);
    expect(r.ci).toEqual([2, 2]);
  });
  it('superiority interval stays in [0, 1] at complete separation', () => {
    const [lo, hi] = superiorityInterval(1, 6, 6, 0.95, 'two-sided');
    expect(hi).toBe(1);
    expect(lo).toBeGreaterThan(0.5);
    expect(lo).toBeLessThan(1);
  });
  it('groups of 300,000 and 200,000: shift found without listing 6e10 differences', () => {
    const first = Array.from({ length: 300_000 }, (_, i) => 2.5 + ((i * 7919) % 10007) / 10007);
    const second = Array.from({ length: 200_000 }, (_, i) => ((i * 104729) % 10009) / 10009);
    const r = rankSum(first, second, opts());
    expectClose(r.estimate, 2.5, 1e-3, 'shift of two uniform samples');
    expect(r.ci[0]).toBeLessThan(r.estimate);
    expect(r.ci[1]).toBeGreaterThan(r.estimate);
  });
});
