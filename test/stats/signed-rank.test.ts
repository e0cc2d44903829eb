import stdlibWilcoxon from '@stdlib/stats-wilcoxon';
import { describe, expect, it } from 'vitest';
import { StatsError } from '../../src/errors.js';
import { signedRankCounts, tailsOf, twoPow } from '../../src/stats/rank-exact.js';
import { signedRank } from '../../src/stats/signed-rank.js';
import type { Alternative, ProcedureOptions } from '../../src/stats/types.js';
import { expectClose, loadFixture } from '../fixtures/scipy-rank/load.js';

interface WilcoxonCase {
  name: string;
  first: number[];
  second: number[];
  alternative: Alternative;
  method: 'exact' | 'normal';
  correction: boolean;
  confidence: number;
  wPlus: number;
  pValue: number;
  estimate: number;
  ciRank: number;
  ci: [number | null, number | null];
}

const opts = (o: Partial<ProcedureOptions> = {}): ProcedureOptions => ({ alternative: 'two-sided', confidence: 0.95, nullValue: 0, ...o });

describe('signed-rank against scipy.stats.wilcoxon (test/fixtures/scipy-rank/wilcoxon.json)', () => {
  const fx = loadFixture<WilcoxonCase>('wilcoxon.json');
  it('fixture records the library version', () => {
    expect(fx.meta.scipy).toMatch(/^\d+\.\d+/);
  });
  for (const c of fx.cases) {
    it(`${c.name}, ${c.alternative}`, () => {
      const r = signedRank(c.first, c.second, opts({ alternative: c.alternative, confidence: c.confidence, method: c.method, correction: c.correction }));
      const label = `${c.name} ${c.alternative}`;
      expect(r.statistic, `${label}: W+`).toBe(c.wPlus);
      // scipy's p comes from the same exact counts or from its own normal tail (cephes ndtr).
      expectClose(r.pValue, c.pValue, 1e-9, `${label}: p-value`);
      // Hodges-Lehmann estimate and interval against all Walsh averages sorted by numpy.
      expectClose(r.estimate, c.estimate, 1e-12, `${label}: estimate`, 1e-12);
      expect(r.details.ciLowerRank ?? r.details.ciUpperRank, `${label}: interval rank`).toBe(
        c.alternative === 'less' ? (r.details.walshAverages as number) + 1 - c.ciRank : c.ciRank,
      );
      expectClose(r.ci[0], c.ci[0], 1e-12, `${label}: lower end`, 1e-12);
      expectClose(r.ci[1], c.ci[1], 1e-12, `${label}: upper end`, 1e-12);
    });
  }
});

describe('signed-rank against @stdlib/stats-wilcoxon (npm)', () => {
  // stdlib computes upper tails as 1 - F, so its small p-values carry only absolute precision;
  // the cases keep p above 1e-4 and compare to 1e-8 relative.
  const cases: Array<{ name: string; x: number[]; y: number[]; mu: number }> = [
    // Quarter units: binary-exact, so no difference is a tie only to rounding (stdlib compares exactly).
    { name: 'hive weights in quarter kilograms, no ties', x: [31.25, 28.5, 35.75, 30, 27.75, 33.5, 29.75, 34.75, 26.5, 32.25, 30.75, 36], y: [29, 28.75, 31.5, 30.5, 25.5, 30.25, 29.5, 31, 27.75, 28.5, 29.5, 33.25], mu: 0 },
    { name: 'ferry delays, ties and zeros', x: [4, 7, 2, 9, 5, 5, 8, 3, 6, 7, 4, 10, 2, 6], y: [3, 7, 4, 6, 5, 2, 6, 3, 4, 7, 1, 8, 2, 3], mu: 0 },
    { name: 'loom faults, null value 1', x: [12, 9, 15, 11, 14, 10, 13, 16, 8, 12, 11, 17], y: [10, 9, 11, 11, 12, 7, 13, 12, 9, 8, 10, 13], mu: 1 },
  ];
  for (const c of cases) {
    for (const alternative of ['two-sided', 'greater', 'less'] as const) {
      for (const correction of [true, false]) {
        it(`${c.name}, ${alternative}, correction ${correction}`, () => {
          const ref = stdlibWilcoxon(c.x, c.y, { alternative, correction, mu: c.mu, zeroMethod: 'wilcox' }) as { pValue: number; statistic: number };
          const r = signedRank(c.x, c.y, opts({ alternative, correction, nullValue: c.mu }));
          expect(r.statistic).toBe(ref.statistic);
          expectClose(r.pValue, Math.min(1, ref.pValue), 1e-8, `${c.name} ${alternative}: p-value vs stdlib`);
        });
      }
    }
  }
});

describe('signed-rank against published tables and examples', () => {
  it('two-sided 5% critical values of W+ (handbook table, e.g. Hollander and Wolfe 1999 Table A.4; from memory)', () => {
    // Largest T with P(W+ <= T) <= 0.025.
    const table: Record<number, number> = { 6: 0, 7: 2, 8: 3, 9: 5, 10: 8, 11: 10, 12: 13, 13: 17, 14: 21, 15: 25, 20: 52, 25: 89 };
    for (const [nText, T] of Object.entries(table)) {
      const n = Number(nText);
      const c = signedRankCounts(n);
      expect(tailsOf(c, T, twoPow(n)).lower, `n = ${n}: P(W+ <= ${T})`).toBeLessThanOrEqual(0.025);
      expect(tailsOf(c, T + 1, twoPow(n)).lower, `n = ${n}: P(W+ <= ${T + 1})`).toBeGreaterThan(0.025);
    }
  });

});

describe('signed-rank edge cases', () => {
  it('too few pairs', () => {
    expect(() => signedRank([1], [2], opts())).toThrowError(expect.objectContaining({ code: 'too-few' }));
  });
  it('unequal numbers of values', () => {
    expect(() => signedRank([1, 2, 3], [1, 2], opts())).toThrowError(/first condition has 3 values and the second 2/);
  });
  it('NaN and Infinity are named with their position', () => {
    expect(() => signedRank([1, NaN, 3], [1, 2, 3], opts())).toThrowError(/value #2 is NaN/);
    expect(() => signedRank([1, 2, 3], [1, 2, Infinity], opts())).toThrowError(expect.objectContaining({ code: 'not-finite' }));
  });
  it('all differences zero: explicit no-variation error saying what it means', () => {
    let err: unknown;
    try {
      signedRank([3, 4, 5], [3, 4, 5], opts());
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(StatsError);
    expect((err as StatsError).code).toBe('no-variation');
    expect((err as StatsError).message).toMatch(/no difference from the null value/);
  });
  it('differences equal to the null value only up to rounding count as zeros', () => {
    // 0.3 - 0.1 - 0.2 is 2.8e-17 in floating point, not 0.
    expect(() => signedRank([0.3, 0.7, 1.1], [0.1, 0.5, 0.9], opts({ nullValue: 0.2 }))).toThrowError(/to rounding/);
  });
  it('decimal differences that agree to rounding are ties (12.3 - 12.1 and 5.4 - 5.2)', () => {
    const r = signedRank([12.3, 5.4, 7.0, 9.5], [12.1, 5.2, 6.1, 9.0], opts());
    expect(r.n.ties).toBe(1);
    expect(r.variant).toMatch(/normal approximation/);
    expect(r.notes.join(' ')).toMatch(/floating-point rounding/);
  });
  it('zeros are dropped (Wilcoxon) and the notes say so; the estimate keeps them', () => {
    const r = signedRank([5, 6, 7, 8, 9, 4], [5, 6, 5, 5, 6, 5], opts());
    expect(r.n.zeros).toBe(2);
    expect(r.details.rankedDifferences).toBe(4);
    expect(r.notes[0]).toMatch(/2 of 6 differences equal the null value 0 and are dropped/);
    // Walsh averages of -1, 0, 0, 2, 3, 3 (numpy: median 1.0).
    expect(r.estimate).toBe(1);
  });
  it('all absolute differences tied: normal approximation with tie correction', () => {
    const r = signedRank([3, 3, 3, 3, 3, 3, 3, 3], [1, 1, 1, 1, 1, 1, 1, 1], opts());
    expect(r.statistic).toBe(36);
    expect(r.variant).toMatch(/tie correction/);
    // var = 8*9*17/24 - (512 - 8)/48 = 51 - 10.5 = 40.5; z = (36 - 18 - 0.5) / sqrt(40.5)
    expectClose(r.details.z as number, 17.5 / Math.sqrt(40.5), 1e-14, 'z');
    expect(r.estimate).toBe(2);
    expect(r.ci).toEqual([2, 2]);
  });
  it('forced exact with ties falls back to the normal approximation and says why', () => {
    const r = signedRank([4, 6, 5, 9, 3, 7], [2, 4, 6, 6, 2, 4], opts({ method: 'exact' }));
    expect(r.variant).toMatch(/normal/);
    expect(r.notes[1]).toMatch(/exact p-value requested, but the exact distribution assumes no ties/);
  });
  it('five pairs cannot reach 95%: widest interval, with a note', () => {
    const r = signedRank([5.1, 6.3, 4.8, 7.2, 6.6], [4.2, 5.0, 5.1, 5.9, 5.7], opts());
    expectClose(r.ci[0], -0.3, 1e-12, 'lower end (smallest difference)');
    expectClose(r.ci[1], 1.3, 1e-12, 'upper end (largest difference)');
    expectClose(r.details.achievedConfidence as number, 1 - 2 / 32, 1e-15, 'achieved confidence');
    expect(r.notes.join(' ')).toMatch(/too few pairs to reach 95%/);
  });
  it('one-sided alternatives give one-sided intervals', () => {
    const x = [2.1, 3.4, 1.9, 4.2, 3.3, 2.8, 3.9, 2.2, 3.1, 4.4];
    const y = [1.8, 2.9, 2.3, 3.1, 2.5, 2.9, 3.0, 1.7, 2.2, 3.5];
    expect(signedRank(x, y, opts({ alternative: 'greater' })).ci[1]).toBe(Infinity);
    expect(signedRank(x, y, opts({ alternative: 'less' })).ci[0]).toBe(-Infinity);
  });
  it('enormous values do not overflow on the way', () => {
    const r = signedRank([1e308, 1.2e308, 0.9e308, 1.6e308], [0.9e308, 1.1e308, 0.95e308, 1.3e308], opts());
    // Differences 0.1, 0.1, -0.05, 0.3 (x 1e308): the Walsh-average median is 0.1e308.
    expectClose(r.estimate, 0.1e308, 1e-12, 'estimate');
    expect(r.ci.every(Number.isFinite)).toBe(true);
  });
  it('an interval end beyond the double range is an explicit error, not Infinity', () => {
    expect(() => signedRank([1e308, 1.5e308, -1e308], [-1e308, 1e308, -1.2e308], opts())).toThrowError(/rescale the data/);
  });
  it('exact p for n = 50 matches counting (2 / 2^50 when all differences are positive)', () => {
    const x = Array.from({ length: 50 }, (_, i) => 10 + i * 0.37);
    const y = x.map((v, i) => v - 0.01 * (i + 1));
    const r = signedRank(x, y, opts());
    expect(r.variant).toBe('exact null distribution of W+');
    expect(r.pValue).toBe(2 / 2 ** 50);
  });
  it('1,000,000 pairs: the Hodges-Lehmann estimate is found without listing the Walsh averages', () => {
    const n = 1_000_000;
    const first = new Array<number>(n);
    const second = new Array<number>(n);
    // Differences 0.5 + a symmetric sawtooth: the centre of symmetry is 0.5.
    for (let i = 0; i < n; i++) {
      first[i] = 100 + (i % 977);
      second[i] = first[i] - 0.5 - (((i * 7919) % 2001) - 1000) / 1000;
    }
    const r = signedRank(first, second, opts());
    expectClose(r.estimate, 0.5, 1e-9, 'estimate');
    expect(r.ci[0]).toBeLessThan(0.5);
    expect(r.ci[1]).toBeGreaterThan(0.5);
    expect(r.ci[1] - r.ci[0]).toBeLessThan(0.01);
  });
});
