/**
 * 2x2 crossover (Hills and Armitage 1979): against an independent route (least squares with
 * subject, period and treatment effects, numpy, in test/fixtures/scipy-t/generate.py), against
 * the pooled t on half differences, and on bad input.
 */
import { describe, expect, it } from 'vitest';
import { crossoverT } from '../../src/stats/crossover-t.js';
import { pooledT } from '../../src/stats/pooled-t.js';
import { runProcedure } from '../../src/stats/index.js';
import type { ProcedureInput } from '../../src/stats/types.js';
import { ALTS, close, closeCi, opts, scipy, SCIPY, statsError } from './t-family-support.js';

type Crossover = Extract<ProcedureInput, { kind: 'crossover' }>;
const input = (fs: [number[], number[]], sf: [number[], number[]]): Crossover => ({
  kind: 'crossover',
  firstThenSecond: { period1: fs[0], period2: fs[1] },
  secondThenFirst: { period1: sf[0], period2: sf[1] },
});

describe('crossover t against least squares with subject, period and treatment effects', () => {
  for (const f of scipy.crossover) {
    it(`${f.name} (${f.firstThenSecond.period1.length} + ${f.secondThenFirst.period1.length} subjects)`, () => {
      const data: Crossover = { kind: 'crossover', firstThenSecond: f.firstThenSecond, secondThenFirst: f.secondThenFirst };
      for (const alt of ALTS) {
        const r = crossoverT(data, opts({ alternative: alt, confidence: f.confidence, nullValue: f.nullValue }));
        const want = f.results[alt];
        const label = `${f.name} ${alt} vs numpy OLS + ${SCIPY}`;
        close(r.estimate, f.estimate, 1e-10, `${label} treatment effect`);
        close(r.details.se as number, f.se, 1e-10, `${label} se`);
        close(r.statistic, want.statistic, 1e-9, `${label} t`);
        expect(r.df).toBe(want.df);
        close(r.pValue, want.pValue, 1e-9, `${label} p`);
        closeCi(r.ci, want.ci, 1e-10, `${label} interval`, Math.abs(f.estimate) + 1e-3);
        close(r.details.periodEffect as number, f.period.estimate, 1e-9, `${label} period effect`, 1e-6);
        closeCi(r.details.periodCi as [number, number], f.period.ci, 1e-9, `${label} period interval`, 1e-3);
        close(r.details.periodPValue as number, f.period.pValue, 1e-8, `${label} period p`);
        close(r.details.carryoverEstimate as number, f.carryover.estimate, 1e-10, `${label} carryover estimate`);
        close(r.details.carryoverT as number, f.carryover.statistic, 1e-9, `${label} carryover t`);
        close(r.details.carryoverPValue as number, f.carryover.pValue, 1e-9, `${label} carryover p`);
        close(r.details.sdWithinSubject as number, f.sdWithinSubject, 1e-10, `${label} within-subject SD`);
      }
    });
  }
});

describe('crossover t: the worked example of the doc comment (invented data, hand arithmetic)', () => {
  const data = input([[12, 14, 11], [10, 11, 10]], [[9, 10, 11], [12, 12, 14]]);
  it('half differences 1, 1.5, 0.5 and -1.5, -1, -1.5 give tau 2.3333, period -0.3333, t = 7 on 4 df', () => {
    const r = runProcedure('crossover-t', data);
    close(r.estimate, 7 / 3, 1e-14, 'tau');
    close(r.details.periodEffect as number, -1 / 3, 1e-13, 'period');
    close(r.details.sdHalfDifferences as number, Math.sqrt(1 / 6), 1e-14, 's_h');
    close(r.details.se as number, 1 / 3, 1e-14, 'se');
    close(r.statistic, 7, 1e-13, 't');
    expect(r.df).toBe(4);
    expect(r.effectSize).toBeNull();
    expect(r.n.pairs).toBe(6);
    expect(r.details.cellMeans).toEqual([37 / 3, 31 / 3, 10, 38 / 3]);
  });
  it('is the pooled t on the half differences (first-then-second minus second-then-first)', () => {
    const r = crossoverT(data, opts({ alternative: 'greater' }));
    const p = pooledT([1, 1.5, 0.5], [-1.5, -1, -1.5], opts({ alternative: 'greater' }));
    close(r.statistic, p.statistic, 1e-14, 'same t');
    close(r.pValue, p.pValue, 1e-14, 'same p');
    close(r.ci[0], p.ci[0], 1e-14, 'same lower bound');
  });
  it('states the no-carryover assumption and that the carryover test is not a decision rule', () => {
    const r = crossoverT(data, opts());
    const notes = r.notes.join(' | ');
    expect(notes).toMatch(/assumes no carryover/);
    expect(notes).toMatch(/low power.*biased \(Freeman 1989\)/);
  });
  it('swapping the two conditions flips the treatment effect and keeps the period effect', () => {
    // Swapping names: old firstThenSecond becomes the new secondThenFirst, periods unchanged.
    const a = crossoverT(data, opts());
    const b = crossoverT(input([[9, 10, 11], [12, 12, 14]], [[12, 14, 11], [10, 11, 10]]), opts());
    close(b.estimate, -a.estimate, 1e-14, 'flipped tau');
    close(b.details.periodEffect as number, a.details.periodEffect as number, 1e-13, 'same period effect');
  });
});

describe('crossover t: bad input on purpose', () => {
  it('unequal period lengths within a sequence', () => {
    const e = statsError(() => crossoverT(input([[1, 2], [1]], [[1, 2], [2, 3]]), opts()));
    expect(e.code).toBe('invalid-option');
    expect(e.message).toMatch(/firstThenSecond: 2 period-1 values but 1 period-2 values/);
  });
  it('an empty sequence, and fewer than 3 subjects', () => {
    expect(statsError(() => crossoverT(input([[], []], [[1, 2], [2, 3]]), opts())).code).toBe('too-few');
    expect(statsError(() => crossoverT(input([[1], [2]], [[4], [3]]), opts())).code).toBe('too-few');
  });
  it('NaN names the sequence and period', () => {
    expect(statsError(() => crossoverT(input([[1, 2], [1, 2]], [[1, 2], [2, NaN]]), opts())).message).toMatch(/secondThenFirst period 2: value #2 is NaN/);
  });
  it('constant half differences: no-variation', () => {
    const e = statsError(() => crossoverT(input([[5, 6], [4, 5]], [[3, 8], [4, 9]]), opts()));
    expect(e.code).toBe('no-variation');
    expect(e.message).toMatch(/half period differences are constant/);
  });
  it('constant subject totals: the carryover parts are null with a note, the rest is computed', () => {
    const r = crossoverT(input([[6, 7], [4, 3]], [[3, 5.5], [7, 4.5]]), opts());
    expect(r.details.carryoverPValue).toBeNull();
    expect(r.notes.join(' ')).toMatch(/subject totals show no variation/);
    expect(Number.isFinite(r.pValue)).toBe(true);
  });
  it('enormous values: scale-stable', () => {
    const fs: [number[], number[]] = [[12.2, 14.1, 11.5, 13.3], [10.4, 11.9, 10.2, 12.0]];
    const sf: [number[], number[]] = [[9.1, 10.7, 11.2], [12.3, 12.2, 14.6]];
    const ref = crossoverT(input(fs, sf), opts());
    const k = 1e300;
    const big = crossoverT(input([fs[0].map((v) => v * k), fs[1].map((v) => v * k)], [sf[0].map((v) => v * k), sf[1].map((v) => v * k)]), opts());
    close(big.statistic, ref.statistic, 1e-12, 't at 1e300');
    close(big.pValue, ref.pValue, 1e-10, 'p at 1e300');
    close(big.estimate, ref.estimate * k, 1e-12, 'tau at 1e300');
  });
  it('the registry refuses crossover-t on paired data and crossover data for other procedures', () => {
    expect(statsError(() => runProcedure('crossover-t', { kind: 'paired', first: [1, 2], second: [2, 3] })).code).toBe('invalid-option');
    expect(statsError(() => runProcedure('paired-t', input([[1, 2], [1, 2]], [[1, 2], [2, 3]]))).code).toBe('invalid-option');
  });
});
