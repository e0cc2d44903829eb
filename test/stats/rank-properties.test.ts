/**
 * Properties every rank and binary procedure must have, checked on random data (fast-check):
 * swapping first and second flips the estimate and the interval and mirrors one-sided p-values;
 * adding a constant to both members of every pair (or to both groups) changes nothing; p-values lie
 * in [0, 1]; the interval holds the estimate. Values are multiples of 1/8, so sums and differences
 * are exact and "changes nothing" can be checked bit for bit.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { mcnemar } from '../../src/stats/mcnemar.js';
import { rankSum } from '../../src/stats/rank-sum.js';
import { MatrixSelector, shiftMatrix, walshMatrix } from '../../src/stats/rank-select.js';
import { signedRank } from '../../src/stats/signed-rank.js';
import { twoProportions } from '../../src/stats/two-proportions.js';
import type { Alternative, ProcedureOptions, TestResult } from '../../src/stats/types.js';

const eighth = fc.integer({ min: -60, max: 60 }).map((v) => v / 8);
const alternative = fc.constantFrom<Alternative>('two-sided', 'greater', 'less');
const method = fc.constantFrom<ProcedureOptions['method']>('auto', 'exact', 'normal');
const confidence = fc.constantFrom(0.8, 0.9, 0.95, 0.99);
const opts = (o: Partial<ProcedureOptions> = {}): ProcedureOptions => ({ alternative: 'two-sided', confidence: 0.95, nullValue: 0, ...o });
/** Negation with -0 folded into 0 (the procedures report 0, never -0). */
const neg = (v: number): number => -v + 0;
const mirror = (a: Alternative): Alternative => (a === 'greater' ? 'less' : a === 'less' ? 'greater' : a);

const pairs = fc
  .array(fc.tuple(eighth, eighth), { minLength: 2, maxLength: 70 })
  .filter((p) => p.some(([x, y]) => x !== y));
const groups = fc
  .tuple(fc.array(eighth, { minLength: 1, maxLength: 40 }), fc.array(eighth, { minLength: 1, maxLength: 40 }))
  .filter(([a, b]) => new Set([...a, ...b]).size > 1);
const binary = fc.constantFrom(0, 1);

function sane(r: TestResult): void {
  expect(r.pValue).toBeGreaterThanOrEqual(0);
  expect(r.pValue).toBeLessThanOrEqual(1);
  expect(r.ci[0]).toBeLessThanOrEqual(r.estimate);
  expect(r.ci[1]).toBeGreaterThanOrEqual(r.estimate);
}

describe('signed-rank properties', () => {
  it('swapping first and second flips estimate and interval, mirrors p-values', () => {
    fc.assert(
      fc.property(pairs, alternative, method, confidence, (p, alt, m, conf) => {
        const x = p.map((v) => v[0]);
        const y = p.map((v) => v[1]);
        const a = signedRank(x, y, opts({ alternative: alt, method: m, confidence: conf }));
        const b = signedRank(y, x, opts({ alternative: mirror(alt), method: m, confidence: conf }));
        sane(a);
        expect(b.estimate).toBe(neg(a.estimate));
        expect(b.ci).toEqual([neg(a.ci[1]), neg(a.ci[0])]);
        expect(b.pValue).toBeCloseTo(a.pValue, 14);
        expect(b.statistic).toBe(a.details.wMinus);
      }),
    );
  });
  it('adding a constant to both members of every pair changes nothing', () => {
    fc.assert(
      fc.property(pairs, eighth, alternative, (p, c, alt) => {
        const x = p.map((v) => v[0]);
        const y = p.map((v) => v[1]);
        const a = signedRank(x, y, opts({ alternative: alt }));
        const b = signedRank(x.map((v) => v + c), y.map((v) => v + c), opts({ alternative: alt }));
        expect([b.statistic, b.pValue, b.estimate, ...b.ci]).toEqual([a.statistic, a.pValue, a.estimate, ...a.ci]);
      }),
    );
  });
  it('testing against a null value equals testing the shifted data', () => {
    fc.assert(
      fc.property(pairs, eighth, (p, mu) => {
        const x = p.map((v) => v[0]);
        const y = p.map((v) => v[1]);
        fc.pre(x.some((v, i) => v - mu !== y[i]));
        const a = signedRank(x, y, opts({ nullValue: mu }));
        const b = signedRank(x.map((v) => v - mu), y, opts());
        expect(a.statistic).toBe(b.statistic);
        expect(a.pValue).toBe(b.pValue);
      }),
    );
  });
});

describe('rank-sum properties', () => {
  it('swapping groups flips the shift and its interval, mirrors p, complements U and PS', () => {
    fc.assert(
      fc.property(groups, alternative, method, confidence, ([x, y], alt, m, conf) => {
        const a = rankSum(x, y, opts({ alternative: alt, method: m, confidence: conf }));
        const b = rankSum(y, x, opts({ alternative: mirror(alt), method: m, confidence: conf }));
        sane(a);
        expect(b.estimate).toBe(neg(a.estimate));
        expect(b.ci).toEqual([neg(a.ci[1]), neg(a.ci[0])]);
        expect(b.pValue).toBeCloseTo(a.pValue, 14);
        expect(b.statistic).toBe(x.length * y.length - a.statistic);
        expect(b.effectSize!.value).toBeCloseTo(1 - a.effectSize!.value, 14);
        const [lo, hi] = a.effectSize!.ci!;
        expect(lo).toBeLessThanOrEqual(a.effectSize!.value);
        expect(hi).toBeGreaterThanOrEqual(a.effectSize!.value);
      }),
    );
  });
  it('adding a constant to every value of both groups changes nothing', () => {
    fc.assert(
      fc.property(groups, eighth, ([x, y], c) => {
        const a = rankSum(x, y, opts());
        const b = rankSum(x.map((v) => v + c), y.map((v) => v + c), opts());
        expect([b.statistic, b.pValue, b.estimate, ...b.ci]).toEqual([a.statistic, a.pValue, a.estimate, ...a.ci]);
      }),
    );
  });
});

describe('binary procedures properties', () => {
  const pairedBinary = fc.array(fc.tuple(binary, binary), { minLength: 1, maxLength: 80 });
  it('mcnemar: swapping flips estimate and interval, mirrors p', () => {
    fc.assert(
      fc.property(pairedBinary, alternative, confidence, (p, alt, conf) => {
        const x = p.map((v) => v[0]);
        const y = p.map((v) => v[1]);
        const a = mcnemar(x, y, opts({ alternative: alt, confidence: conf }));
        const b = mcnemar(y, x, opts({ alternative: mirror(alt), confidence: conf }));
        sane(a);
        expect(b.estimate).toBe(neg(a.estimate));
        expect(b.ci[0]).toBeCloseTo(-a.ci[1], 15);
        expect(b.ci[1]).toBeCloseTo(-a.ci[0], 15);
        expect(b.pValue).toBeCloseTo(a.pValue, 14);
      }),
    );
  });
  it('two-proportions: swapping flips estimate and interval, inverts the odds ratio, mirrors p', () => {
    fc.assert(
      fc.property(fc.array(binary, { minLength: 1, maxLength: 60 }), fc.array(binary, { minLength: 1, maxLength: 60 }), alternative, (x, y, alt) => {
        const a = twoProportions(x, y, opts({ alternative: alt }));
        const b = twoProportions(y, x, opts({ alternative: mirror(alt) }));
        sane(a);
        expect(b.estimate).toBe(neg(a.estimate));
        expect(b.ci[0]).toBeCloseTo(-a.ci[1], 14);
        expect(b.ci[1]).toBeCloseTo(-a.ci[0], 14);
        expect(b.pValue).toBeCloseTo(a.pValue, 12);
        if (a.effectSize && Number.isFinite(a.effectSize.value) && a.effectSize.value > 0) {
          expect(b.effectSize!.value * a.effectSize.value).toBeCloseTo(1, 8);
        }
      }),
    );
  });
});

describe('order statistics of the implicit matrices (rank-select.ts) equal those of the listed matrix', () => {
  // Sizes above the listing threshold (65536 entries) exercise the sampling rounds.
  function listed(r: Float64Array, c: Float64Array, triangular: boolean): Float64Array {
    const out: number[] = [];
    for (let i = 0; i < r.length; i++) for (let j = triangular ? i : 0; j < c.length; j++) out.push(r[i] + c[j]);
    return Float64Array.from(out).sort();
  }
  const cases: Array<[string, number, (i: number) => number]> = [
    ['continuous', 1500, (i) => Math.sin(i * 12.9898) * 43.7],
    ['heavy ties', 1200, (i) => ((i * 7) % 9) - 3],
    ['one value', 700, () => 2.5],
  ];
  for (const [name, n, gen] of cases) {
    it(`Walsh averages and pairwise differences, ${name}`, () => {
      const d = Float64Array.from({ length: n }, (_, i) => gen(i)).sort();
      const y = Float64Array.from({ length: Math.floor(n * 0.6) }, (_, i) => gen(i + 5000) * 0.7).sort();
      for (const m of [walshMatrix(d), shiftMatrix(d, y)]) {
        const all = listed(m.r, m.c, m.triangular);
        expect(all.length).toBe(m.size);
        const ranks = [1, 2, Math.ceil(m.size / 3), Math.floor(m.size / 2), Math.floor(m.size / 2) + 1, m.size - 1, m.size];
        const sel = new MatrixSelector(m);
        expect(sel.kths(ranks)).toEqual(ranks.map((k) => all[k - 1]));
        for (const k of ranks) expect(sel.kth(k)).toBe(all[k - 1]);
        const mid = m.size % 2 ? all[(m.size - 1) / 2] : all[m.size / 2 - 1] * 0.5 + all[m.size / 2] * 0.5;
        expect(sel.median()).toBe(mid);
      }
    });
  }
});
