/**
 * Properties of the t family (fast-check): swapping first and second flips the estimate and the
 * interval and mirrors one-sided p-values; adding a constant to both members of a pair changes
 * nothing; p-values lie in [0, 1]; the interval holds the estimate.
 *
 * Values are multiples of 1/8 so that sums and differences are exact in binary floating point:
 * the properties then hold to the last bit instead of only approximately.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { StatsError } from '../../src/errors.js';
import { runProcedure } from '../../src/stats/index.js';
import type { Alternative, ProcedureId, TestResult } from '../../src/stats/types.js';
import { ALTS, close } from './t-family-support.js';

const RUNS = { numRuns: 60 };
const value = fc.integer({ min: -8000, max: 8000 }).map((k) => k / 8);
const alternative = fc.constantFrom<Alternative>(...ALTS);
const confidence = fc.constantFrom(0.8, 0.9, 0.95, 0.99);

const pairs = fc
  .integer({ min: 2, max: 25 })
  .chain((n) => fc.tuple(fc.array(value, { minLength: n, maxLength: n }), fc.array(value, { minLength: n, maxLength: n })));
const groups = fc.tuple(fc.array(value, { minLength: 2, maxLength: 25 }), fc.array(value, { minLength: 2, maxLength: 25 }));

/** Runs a procedure; data without variation are outside the property (precondition). */
function attempt(fn: () => TestResult): TestResult {
  try {
    return fn();
  } catch (e) {
    if (e instanceof StatsError && e.code === 'no-variation') fc.pre(false);
    throw e;
  }
}

function mirrored(a: TestResult, b: TestResult, label: string): void {
  close(b.estimate, -a.estimate, 1e-12, `${label}: estimate flips`, 1e-9);
  close(b.ci[0], -a.ci[1], 1e-12, `${label}: lower end = -(upper end)`, 1e-9);
  close(b.ci[1], -a.ci[0], 1e-12, `${label}: upper end = -(lower end)`, 1e-9);
  close(b.statistic, -a.statistic, 1e-12, `${label}: t flips`, 1e-12);
  if (a.effectSize && b.effectSize) close(b.effectSize.value, -a.effectSize.value, 1e-12, `${label}: effect size flips`, 1e-12);
}

describe('swapping first and second', () => {
  const paired: ProcedureId[] = ['paired-t'];
  const independent: ProcedureId[] = ['welch-t', 'pooled-t'];
  it('paired t: flips estimate, interval and t; two-sided p unchanged; greater and less exchange', () => {
    fc.assert(
      fc.property(pairs, confidence, ([x, y], conf) => {
        const run = (a: number[], b: number[], alt: Alternative) =>
          attempt(() => runProcedure(paired[0], { kind: 'paired', first: a, second: b }, { alternative: alt, confidence: conf }));
        mirrored(run(x, y, 'two-sided'), run(y, x, 'two-sided'), 'paired two-sided');
        close(run(y, x, 'two-sided').pValue, run(x, y, 'two-sided').pValue, 1e-12, 'two-sided p', 1e-300);
        const g = run(x, y, 'greater');
        const l = run(y, x, 'less');
        close(l.pValue, g.pValue, 1e-12, 'p(greater) = p(less) after the swap', 1e-300);
        mirrored(g, l, 'paired one-sided');
      }),
      RUNS,
    );
  });
  for (const id of independent) {
    it(`${id}: the same mirror`, () => {
      fc.assert(
        fc.property(groups, alternative, confidence, ([x, y], alt, conf) => {
          const flip: Alternative = alt === 'greater' ? 'less' : alt === 'less' ? 'greater' : alt;
          const a = attempt(() => runProcedure(id, { kind: 'independent', first: x, second: y }, { alternative: alt, confidence: conf }));
          const b = attempt(() => runProcedure(id, { kind: 'independent', first: y, second: x }, { alternative: flip, confidence: conf }));
          mirrored(a, b, id);
          close(b.pValue, a.pValue, 1e-12, `${id} p mirrors`, 1e-300);
          expect(b.df).toBe(a.df);
        }),
        RUNS,
      );
    });
  }
});

describe('adding a constant to both members of every pair changes nothing', () => {
  it('paired t, one constant per pair (exact arithmetic on multiples of 1/8)', () => {
    const offsets = fc.array(fc.integer({ min: -100000, max: 100000 }), { minLength: 25, maxLength: 25 });
    fc.assert(
      fc.property(pairs, offsets, alternative, ([x, y], c, alt) => {
        const a = attempt(() => runProcedure('paired-t', { kind: 'paired', first: x, second: y }, { alternative: alt }));
        const b = runProcedure('paired-t', { kind: 'paired', first: x.map((v, i) => v + c[i]), second: y.map((v, i) => v + c[i]) }, { alternative: alt });
        expect(b.statistic).toBe(a.statistic);
        expect(b.pValue).toBe(a.pValue);
        expect(b.ci).toEqual(a.ci);
        expect(b.estimate).toBe(a.estimate);
        expect(b.effectSize!.value).toBe(a.effectSize!.value);
      }),
      RUNS,
    );
  });
});

describe('p-values in [0, 1] and the interval holds the estimate', () => {
  const cases: { id: ProcedureId; kind: 'paired' | 'independent' }[] = [
    { id: 'paired-t', kind: 'paired' },
    { id: 'welch-t', kind: 'independent' },
    { id: 'pooled-t', kind: 'independent' },
    { id: 'paired-equivalence', kind: 'paired' },
    { id: 'welch-equivalence', kind: 'independent' },
  ];
  for (const { id, kind } of cases) {
    it(id, () => {
      const equivalence = id.endsWith('equivalence');
      fc.assert(
        fc.property(kind === 'paired' ? pairs : groups, equivalence ? fc.constant<Alternative>('two-sided') : alternative, confidence, ([x, y], alt, conf) => {
          const r = attempt(() =>
            runProcedure(id, { kind, first: x, second: y }, { alternative: alt, confidence: conf, ...(equivalence ? { margin: 50 } : {}) }),
          );
          expect(r.pValue).toBeGreaterThanOrEqual(0);
          expect(r.pValue).toBeLessThanOrEqual(1);
          expect(r.ci[0]).toBeLessThanOrEqual(r.estimate);
          expect(r.ci[1]).toBeGreaterThanOrEqual(r.estimate);
          for (const key of ['pLower', 'pUpper'] as const) {
            if (equivalence) expect((r.details[key] as number) >= 0 && (r.details[key] as number) <= 1).toBe(true);
          }
          if (r.effectSize?.ci) expect(r.effectSize.ci[0]).toBeLessThanOrEqual(r.effectSize.ci[1]);
        }),
        RUNS,
      );
    });
  }
  it('crossover-t', () => {
    const seq = fc
      .integer({ min: 1, max: 12 })
      .chain((n) => fc.tuple(fc.array(value, { minLength: n, maxLength: n }), fc.array(value, { minLength: n, maxLength: n })));
    fc.assert(
      fc.property(seq, seq, alternative, ([a1, a2], [b1, b2], alt) => {
        fc.pre(a1.length + b1.length >= 3);
        const r = attempt(() =>
          runProcedure('crossover-t', { kind: 'crossover', firstThenSecond: { period1: a1, period2: a2 }, secondThenFirst: { period1: b1, period2: b2 } }, { alternative: alt }),
        );
        expect(r.pValue >= 0 && r.pValue <= 1).toBe(true);
        expect(r.ci[0] <= r.estimate && r.estimate <= r.ci[1]).toBe(true);
        const pp = r.details.periodPValue as number;
        expect(pp >= 0 && pp <= 1).toBe(true);
      }),
      RUNS,
    );
  });
});
