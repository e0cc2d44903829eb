/**
 * Properties any correct sample-size answer must have, checked on random inputs with fast-check.
 * (Reasoning, not a published source: exact power of the t test rises with n, with the true
 * difference and with alpha, so the smallest n can only grow as the difference shrinks, as alpha
 * shrinks and as the target power grows. Pairing with a positive correlation shrinks the SD of
 * differences below sigma * sqrt(2), so the pairs needed never exceed the units of two groups.)
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { resolveInputs, type RawSizeInputs } from '../../src/size/inputs.js';
import { planPower, sampleSize } from '../../src/size/solve.js';

const n = (raw: RawSizeInputs): number => sampleSize(resolveInputs(raw).spec).layout.n;
const total = (raw: RawSizeInputs): number => sampleSize(resolveInputs(raw).spec).layout.total;

const design = fc.constantFrom<'paired' | 'independent'>('paired', 'independent');
const alternative = fc.constantFrom<'two-sided' | 'greater'>('two-sided', 'greater');
const effect = fc.double({ min: 0.15, max: 2, noNaN: true });
const alpha = fc.double({ min: 0.005, max: 0.2, noNaN: true });
const power = fc.double({ min: 0.5, max: 0.99, noNaN: true });
const RUNS = { numRuns: 40 };

describe('sample size: monotone in its inputs', () => {
  it('the answer is the smallest n: power(n) >= target > power(n - 1)', () => {
    fc.assert(
      fc.property(design, alternative, effect, alpha, power, (dsg, alt, e, a, p) => {
        const spec = resolveInputs({ design: dsg, alternative: alt, effectSize: e, alpha: a, power: p }).spec;
        const ans = sampleSize(spec);
        expect(ans.power).toBeGreaterThanOrEqual(p);
        if (!ans.atMinimum) expect(planPower(spec, ans.layout.n - 1)).toBeLessThan(p);
      }),
      RUNS,
    );
  });
  it('n grows as the difference shrinks', () => {
    fc.assert(
      fc.property(design, effect, effect, alpha, power, (dsg, e1, e2, a, p) => {
        const [big, small] = e1 >= e2 ? [e1, e2] : [e2, e1];
        expect(n({ design: dsg, effectSize: small, alpha: a, power: p })).toBeGreaterThanOrEqual(n({ design: dsg, effectSize: big, alpha: a, power: p }));
      }),
      RUNS,
    );
  });
  it('n grows as alpha shrinks', () => {
    fc.assert(
      fc.property(design, effect, alpha, alpha, power, (dsg, e, a1, a2, p) => {
        const [lo, hi] = a1 <= a2 ? [a1, a2] : [a2, a1];
        expect(n({ design: dsg, effectSize: e, alpha: lo, power: p })).toBeGreaterThanOrEqual(n({ design: dsg, effectSize: e, alpha: hi, power: p }));
      }),
      RUNS,
    );
  });
  it('n grows as the target power grows', () => {
    fc.assert(
      fc.property(design, effect, alpha, power, power, (dsg, e, a, p1, p2) => {
        const [lo, hi] = p1 <= p2 ? [p1, p2] : [p2, p1];
        expect(n({ design: dsg, effectSize: e, alpha: a, power: hi })).toBeGreaterThanOrEqual(n({ design: dsg, effectSize: e, alpha: a, power: lo }));
      }),
      RUNS,
    );
  });
  it('pairing with rho > 0 never needs more units than two independent groups with the same SD', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.2, max: 3, noNaN: true }),
        fc.double({ min: 0.5, max: 4, noNaN: true }),
        fc.double({ min: 0.001, max: 0.95, noNaN: true }),
        alpha,
        power,
        (diff, sd, rho, a, p) => {
          const pairs = n({ design: 'paired', difference: diff, sd, rho, alpha: a, power: p });
          const units = total({ design: 'independent', difference: diff, sd, alpha: a, power: p });
          expect(pairs).toBeLessThanOrEqual(units);
        },
      ),
      RUNS,
    );
  });
  it('equivalence: n grows as the margin narrows', () => {
    fc.assert(
      fc.property(design, fc.double({ min: 0.3, max: 2, noNaN: true }), fc.double({ min: 0.3, max: 2, noNaN: true }), (dsg, m1, m2) => {
        const [narrow, wide] = m1 <= m2 ? [m1, m2] : [m2, m1];
        const base = { design: dsg, effectSize: 0.1 } as const;
        if (narrow <= 0.1) return;
        expect(n({ ...base, margin: narrow })).toBeGreaterThanOrEqual(n({ ...base, margin: wide }));
      }),
      { numRuns: 20 },
    );
  });
});
