import { describe, expect, it } from 'vitest';
import { conditionalOddsRatio, fisherPValue } from '../../src/stats/binary-fisher.js';
import { newcombeIndependent, wilson } from '../../src/stats/binary-intervals.js';
import { twoProportions } from '../../src/stats/two-proportions.js';
import type { Alternative, ProcedureOptions } from '../../src/stats/types.js';
import { expectClose, loadFixture } from '../fixtures/scipy-rank/load.js';

interface FisherCase {
  x1: number;
  n1: number;
  x2: number;
  n2: number;
  fisher: Record<Alternative, number>;
  hasOddsRatio: boolean;
  /** null: infinite */
  oddsRatio: number | null;
  orCi: Partial<Record<Alternative, [number, number | null]>>;
  zTwoSided?: number;
  zTwoSidedYates?: number;
}

const opts = (o: Partial<ProcedureOptions> = {}): ProcedureOptions => ({ alternative: 'two-sided', confidence: 0.95, nullValue: 0, ...o });
const group = (x: number, n: number): number[] => Array.from({ length: n }, (_, i) => (i < x ? 1 : 0));

describe('two-proportions against scipy (test/fixtures/scipy-rank/fisher.json)', () => {
  const fx = loadFixture<FisherCase>('fisher.json');
  for (const c of fx.cases) {
    const label = `${c.x1}/${c.n1} vs ${c.x2}/${c.n2}`;
    it(`${label}: Fisher's exact p = scipy.stats.fisher_exact`, () => {
      for (const alternative of ['two-sided', 'greater', 'less'] as const) {
        expectClose(fisherPValue(c.x1, c.n1, c.x2, c.n2, alternative), c.fisher[alternative], 1e-9, `${label} ${alternative}: Fisher p`);
        const r = twoProportions(group(c.x1, c.n1), group(c.x2, c.n2), opts({ alternative }));
        expectClose(r.details.fisherPValue as number, c.fisher[alternative], 1e-9, `${label} ${alternative}: details.fisherPValue`);
      }
    });
    if (c.hasOddsRatio) {
      it(`${label}: conditional odds ratio and exact interval = scipy.stats.contingency.odds_ratio`, () => {
        for (const alternative of ['two-sided', 'greater', 'less'] as const) {
          const or = conditionalOddsRatio(c.x1, c.n1, c.x2, c.n2, 0.95, alternative);
          expectClose(or.estimate, c.oddsRatio, 1e-8, `${label}: odds ratio`);
          const ref = c.orCi[alternative]!;
          expectClose(or.ci[0], ref[0], 1e-7, `${label} ${alternative}: odds ratio lower`, 1e-12);
          expectClose(or.ci[1], ref[1], 1e-7, `${label} ${alternative}: odds ratio upper`);
        }
      });
      it(`${label}: pooled z test two-sided p = scipy.stats.chi2_contingency (with and without Yates)`, () => {
        const plain = twoProportions(group(c.x1, c.n1), group(c.x2, c.n2), opts({ correction: false }));
        expectClose(plain.details.zPValue as number, c.zTwoSided!, 1e-9, `${label}: z p`);
        const yates = twoProportions(group(c.x1, c.n1), group(c.x2, c.n2), opts({ correction: true }));
        expectClose(yates.details.zPValue as number, c.zTwoSidedYates!, 1e-9, `${label}: z p with Yates`);
      });
    }
  }
});

describe('two-proportions against published worked examples', () => {
  // Newcombe (1998a), Statistics in Medicine 17:873-890, Table II, method 10 (from memory).
  const table: Array<[string, number, number, number, number, string, string]> = [
    ['(a)', 56, 70, 48, 80, '0.0524', '0.3339'],
    ['(b)', 9, 10, 3, 10, '0.1705', '0.8090'],
    ['(d)', 5, 56, 0, 29, '-0.0381', '0.1926'],
    ['(e)', 0, 10, 0, 20, '-0.1611', '0.2775'],
    ['(f)', 0, 10, 0, 10, '-0.2775', '0.2775'],
    ['(g)', 10, 10, 0, 20, '0.6791', '1.0000'],
  ];
  for (const [name, x1, n1, x2, n2, lo, hi] of table) {
    it(`Newcombe 1998a example ${name}: ${x1}/${n1} - ${x2}/${n2}, interval ${lo} to ${hi}`, () => {
      const r = twoProportions(group(x1, n1), group(x2, n2), opts());
      expect(r.ci.map((v) => v.toFixed(4))).toEqual([lo, hi]);
    });
  }
  it('Wilson (1927) interval reaches 0 and 1 exactly at the edges', () => {
    expect(wilson(0, 10, 1.96)[0]).toBe(0);
    expect(wilson(10, 10, 1.96)[1]).toBe(1);
    const [l, u] = newcombeIndependent(0, 10, 0, 10, 1.96);
    expect(l).toBeCloseTo(-u, 15);
  });
});

describe('two-proportions behaviour and edge cases', () => {
  it('Fisher primary when an expected count is below 5, z test otherwise; both reported', () => {
    const small = twoProportions(group(9, 10), group(3, 10), opts());
    expect(small.variant).toBe("Fisher's exact test");
    expect(small.statisticName).toMatch(/x1/);
    expect(small.details.zPValue).toBeGreaterThan(0);
    const large = twoProportions(group(56, 70), group(48, 80), opts());
    expect(large.variant).toMatch(/z test/);
    expect(large.details.fisherPValue).toBeGreaterThan(0);
  });
  it('not binary, NaN, empty group, null value', () => {
    expect(() => twoProportions([1, 0, 0.5], [1], opts())).toThrowError(/value #3 is 0.5/);
    expect(() => twoProportions([1, 0], [NaN], opts())).toThrowError(expect.objectContaining({ code: 'not-finite' }));
    expect(() => twoProportions([], [1], opts())).toThrowError(expect.objectContaining({ code: 'too-few' }));
    expect(() => twoProportions([1], [1], opts({ nullValue: 0.2 }))).toThrowError(expect.objectContaining({ code: 'unsupported' }));
  });
  it('empty cells: odds ratio 0 or infinite with a one-sided interval and a note', () => {
    const r = twoProportions(group(5, 56), group(0, 29), opts());
    expect(r.effectSize!.value).toBe(Infinity);
    expect(r.effectSize!.ci![1]).toBe(Infinity);
    expect(r.notes.join(' ')).toMatch(/a cell of the 2x2 table is empty/);
  });
  it('no events at all: z undefined (said), Fisher p = 1, no odds ratio', () => {
    const r = twoProportions(group(0, 8), group(0, 9), opts({ method: 'normal' }));
    expect(r.pValue).toBe(1);
    expect(r.details.z).toBeNull();
    expect(r.variant).toBe("Fisher's exact test");
    expect(r.effectSize).toBeNull();
  });
  it("a one-sided Fisher p-value is described as one-sided, not as the two-sided sum", () => {
    const g = twoProportions(group(9, 10), group(3, 10), opts({ alternative: 'greater' }));
    expect(g.variant).toBe("Fisher's exact test");
    expect(g.notes.join(' ')).toMatch(/one-sided, P\(events in first >= 9\) given the margins/);
    expect(g.notes.join(' ')).not.toMatch(/two-sided as the sum/);
    expect(twoProportions(group(9, 10), group(3, 10), opts()).notes.join(' ')).toMatch(/two-sided as the sum/);
  });
  it('one-sided alternatives: interval ends at 1 or -1', () => {
    expect(twoProportions(group(9, 10), group(3, 10), opts({ alternative: 'greater' })).ci[1]).toBe(1);
    expect(twoProportions(group(9, 10), group(3, 10), opts({ alternative: 'less' })).ci[0]).toBe(-1);
  });
});
