import { describe, expect, it } from 'vitest';
import { mcnemar } from '../../src/stats/mcnemar.js';
import type { Alternative, ProcedureOptions } from '../../src/stats/types.js';
import { expectClose, loadFixture } from '../fixtures/scipy-rank/load.js';

interface McNemarCase {
  a: number;
  b: number;
  c: number;
  d: number;
  exact: Record<Alternative, number>;
  chiSquare?: number;
  chiSquarePValue?: number;
  chiSquarePlain?: number;
  chiSquarePlainPValue?: number;
}

const opts = (o: Partial<ProcedureOptions> = {}): ProcedureOptions => ({ alternative: 'two-sided', confidence: 0.95, nullValue: 0, ...o });

/** Pairs in the order a (1,1), b (1,0), c (0,1), d (0,0). */
function pairs(a: number, b: number, c: number, d: number): [number[], number[]] {
  const first: number[] = [];
  const second: number[] = [];
  const push = (x: number, y: number, k: number): void => {
    for (let i = 0; i < k; i++) {
      first.push(x);
      second.push(y);
    }
  };
  push(1, 1, a);
  push(1, 0, b);
  push(0, 1, c);
  push(0, 0, d);
  return [first, second];
}

describe('mcnemar against scipy (test/fixtures/scipy-rank/mcnemar.json)', () => {
  const fx = loadFixture<McNemarCase>('mcnemar.json');
  for (const c of fx.cases) {
    const label = `a=${c.a} b=${c.b} c=${c.c} d=${c.d}`;
    for (const alternative of ['two-sided', 'greater', 'less'] as const) {
      it(`${label}, ${alternative}: exact p = scipy.stats.binomtest`, () => {
        const [f, s] = pairs(c.a, c.b, c.c, c.d);
        const r = mcnemar(f, s, opts({ alternative }));
        expect(r.details.b).toBe(c.b);
        expect(r.details.c).toBe(c.c);
        expectClose(r.pValue, c.exact[alternative], 1e-10, `${label} ${alternative}: exact p`);
      });
    }
    if (c.chiSquare !== undefined) {
      it(`${label}: chi-square with and without continuity correction = scipy.stats.chi2.sf`, () => {
        const [f, s] = pairs(c.a, c.b, c.c, c.d);
        const withCc = mcnemar(f, s, opts());
        expectClose(withCc.details.chiSquare as number, c.chiSquare!, 1e-14, `${label}: X2 corrected`);
        expectClose(withCc.details.chiSquarePValue as number, c.chiSquarePValue!, 1e-10, `${label}: p corrected`);
        const plain = mcnemar(f, s, opts({ correction: false, method: 'normal' }));
        expect(plain.statisticName).toBe('chi-square');
        expect(plain.df).toBe(1);
        expectClose(plain.statistic, c.chiSquarePlain!, 1e-14, `${label}: X2 plain`);
        expectClose(plain.pValue, c.chiSquarePlainPValue!, 1e-10, `${label}: p plain`);
      });
    }
  }
});

describe('mcnemar against a published worked example', () => {
  it('Fagerland, Lydersen and Laake (2017), ch. 8, Cavo et al. (2012) data (values as in the contingencytables R package tests)', () => {
    const [f, s] = pairs(59, 6, 16, 80);
    const r = mcnemar(f, s, opts());
    expect(r.estimate.toFixed(4)).toBe('-0.0621');
    // Newcombe square-and-add interval: -0.1186 to -0.0046.
    expect(r.ci.map((v) => v.toFixed(4))).toEqual(['-0.1186', '-0.0046']);
    // Transformed Wilson score interval for the paired odds ratio: 0.3750 (0.1514 to 0.9287).
    expect(r.effectSize!.value).toBe(0.375);
    expect(r.effectSize!.ci!.map((v) => v.toFixed(4))).toEqual(['0.1514', '0.9287']);
  });
});

describe('mcnemar edge cases', () => {
  it('not binary, NaN, unequal lengths, too few', () => {
    expect(() => mcnemar([0, 1, 2], [0, 1, 1], opts())).toThrowError(/value #3 is 2; binary outcomes must be coded 0/);
    expect(() => mcnemar([0, 1, 2], [0, 1, 1], opts())).toThrowError(expect.objectContaining({ code: 'not-binary' }));
    expect(() => mcnemar([0, NaN], [0, 1], opts())).toThrowError(expect.objectContaining({ code: 'not-finite' }));
    expect(() => mcnemar([0, 1], [0], opts())).toThrowError(/paired data need one value of each per pair/);
    expect(() => mcnemar([], [], opts())).toThrowError(expect.objectContaining({ code: 'too-few' }));
  });
  it('a null value other than 0 is refused', () => {
    expect(() => mcnemar([0, 1], [1, 1], opts({ nullValue: 0.1 }))).toThrowError(expect.objectContaining({ code: 'unsupported' }));
  });
  it('no discordant pairs: p = 1, said plainly; the interval still has width', () => {
    const [f, s] = pairs(12, 0, 0, 9);
    const r = mcnemar(f, s, opts());
    expect(r.pValue).toBe(1);
    expect(r.estimate).toBe(0);
    expect(r.ci[0]).toBeLessThan(0);
    expect(r.ci[1]).toBeGreaterThan(0);
    expect(r.notes.join(' ')).toMatch(/no discordant pairs/);
    expect(r.details.chiSquare).toBeNull();
    expect(r.effectSize).toBeNull();
  });
  it('a single discordant pair', () => {
    const [f, s] = pairs(5, 1, 0, 4);
    const r = mcnemar(f, s, opts());
    expect(r.pValue).toBe(1);
    expect(r.estimate).toBeCloseTo(0.1, 15);
    expect(mcnemar(f, s, opts({ alternative: 'greater' })).pValue).toBe(0.5);
    expect(r.notes.join(' ')).toMatch(/with c = 0 the ratio b \/ c is infinite/);
  });
  it('asymptotic primary on request; the exact p stays in details', () => {
    const [f, s] = pairs(20, 14, 4, 30);
    const r = mcnemar(f, s, opts({ method: 'normal' }));
    expect(r.variant).toMatch(/asymptotic/);
    expect(r.details.exactPValue).toBeGreaterThan(0);
    expect(r.notes.join(' ')).toMatch(/the exact p-value is/);
  });
});
