/**
 * Equivalence by two one-sided tests (Schuirmann 1987), paired and Welch: against scipy one-sided
 * tests at shifted nulls and scipy's (1 - 2 alpha) interval, and the option rules.
 */
import { describe, expect, it } from 'vitest';
import { pairedEquivalence, welchEquivalence } from '../../src/stats/equivalence.js';
import { pairedT } from '../../src/stats/paired-t.js';
import { welchT } from '../../src/stats/welch-t.js';
import { runProcedure } from '../../src/stats/index.js';
import { close, closeCi, opts, scipy, SCIPY, statsError, type TostFixture } from './t-family-support.js';

function checkAgainst(f: TostFixture, fn: typeof pairedEquivalence, kind: string): void {
  const r = fn(f.first, f.second, opts({ margin: f.margin, confidence: f.confidence }));
  const label = `${kind} ${f.name} vs ${SCIPY}`;
  close(r.details.tLower as number, f.tLower, 1e-10, `${label} t lower`);
  close(r.details.tUpper as number, f.tUpper, 1e-10, `${label} t upper`);
  close(r.details.pLower as number, f.pLower, 1e-9, `${label} p lower`);
  close(r.details.pUpper as number, f.pUpper, 1e-9, `${label} p upper`);
  close(r.pValue, f.pValue, 1e-9, `${label} decision p = max`);
  close(r.df!, f.df, 1e-11, `${label} df`);
  close(r.confidence, f.level, 1e-14, `${label} interval level`);
  close(r.details.alpha as number, 1 - f.confidence, 1e-14, `${label} alpha`);
  closeCi(r.ci, f.ci, 1e-10, `${label} (1 - 2 alpha) interval`, Math.abs(f.estimate) + 1e-3);
  expect(r.details.intervalInsideMargin).toBe(f.ci[0]! > -f.margin && f.ci[1]! < f.margin);
  expect(r.details.intervalInsideMargin).toBe(r.pValue < (r.details.alpha as number));
}

describe('paired equivalence against scipy', () => {
  for (const f of scipy.pairedEquivalence) it(f.name, () => checkAgainst(f, pairedEquivalence, 'paired'));
});

describe('Welch equivalence against scipy', () => {
  for (const f of scipy.welchEquivalence) it(f.name, () => checkAgainst(f, welchEquivalence, 'Welch'));
});

describe('equivalence: construction', () => {
  const first = [20.1, 19.8, 20.6, 20.3, 19.9, 20.4, 20.0, 20.2];
  const second = [20.0, 19.9, 20.3, 20.4, 19.7, 20.2, 20.1, 20.0];
  it('default confidence 0.95 gives a 90% interval and alpha 0.05; the p-value is the larger one-sided p', () => {
    const r = runProcedure('paired-equivalence', { kind: 'paired', first, second }, { margin: 0.3 });
    close(r.confidence, 0.9, 1e-14, 'interval level');
    close(r.details.alpha as number, 0.05, 1e-14, 'alpha');
    expect(r.pValue).toBe(Math.max(r.details.pLower as number, r.details.pUpper as number));
    expect(r.alternative).toBe('two-sided');
    expect(r.details.margin).toBe(0.3);
    expect(r.details.lowerMargin).toBe(-0.3);
  });
  it('the one-sided p-values are those of the paired t at -margin (greater) and +margin (less)', () => {
    const r = pairedEquivalence(first, second, opts({ margin: 0.3 }));
    const lo = pairedT(first, second, opts({ nullValue: -0.3, alternative: 'greater' }));
    const up = pairedT(first, second, opts({ nullValue: 0.3, alternative: 'less' }));
    close(r.details.pLower as number, lo.pValue, 1e-13, 'p lower = paired t greater at -margin');
    close(r.details.pUpper as number, up.pValue, 1e-13, 'p upper = paired t less at +margin');
    const ci90 = pairedT(first, second, opts({ confidence: 0.9 })).ci;
    close(r.ci[0], ci90[0], 1e-13, '90% interval lower');
    close(r.ci[1], ci90[1], 1e-13, '90% interval upper');
    expect(r.effectSize!.name).toBe('d_z');
  });
  it('Welch: the one-sided p-values are those of Welch t at the shifted nulls', () => {
    const a = [5.2, 5.6, 4.9, 5.1, 5.4, 5.0];
    const b = [5.3, 5.9, 5.1, 5.5, 4.8, 5.7, 5.2];
    const r = welchEquivalence(a, b, opts({ margin: 0.5, confidence: 0.9 }));
    const lo = welchT(a, b, opts({ nullValue: -0.5, alternative: 'greater' }));
    const up = welchT(a, b, opts({ nullValue: 0.5, alternative: 'less' }));
    close(r.details.pLower as number, lo.pValue, 1e-13, 'p lower');
    close(r.details.pUpper as number, up.pValue, 1e-13, 'p upper');
    close(r.confidence, 0.8, 1e-14, '80% interval for confidence 0.9');
    expect(r.effectSize!.name).toBe("Hedges' g");
  });
  it('swapping first and second swaps the two one-sided p-values', () => {
    const r = pairedEquivalence(first, second, opts({ margin: 0.3 }));
    const s = pairedEquivalence(second, first, opts({ margin: 0.3 }));
    close(s.details.pLower as number, r.details.pUpper as number, 1e-12, 'swap lower/upper');
    close(s.details.pUpper as number, r.details.pLower as number, 1e-12, 'swap upper/lower');
    close(s.pValue, r.pValue, 1e-12, 'same decision p');
  });
});

describe('equivalence: option rules and bad input', () => {
  it('margin missing: invalid-option naming the option', () => {
    const e = statsError(() => pairedEquivalence([1, 2, 3], [1, 2, 4], opts()));
    expect(e.code).toBe('invalid-option');
    expect(e.message).toMatch(/needs an equivalence margin/);
    expect(statsError(() => welchEquivalence([1, 2, 3], [1, 2, 4], opts())).code).toBe('invalid-option');
  });
  it('a one-sided alternative, a non-zero null or confidence <= 0.5 are refused', () => {
    expect(statsError(() => pairedEquivalence([1, 2, 3], [1, 2, 4], opts({ margin: 1, alternative: 'greater' }))).message).toMatch(/two one-sided tests by construction/);
    expect(statsError(() => pairedEquivalence([1, 2, 3], [1, 2, 4], opts({ margin: 1, nullValue: 0.2 }))).message).toMatch(/null value does not apply/);
    expect(statsError(() => pairedEquivalence([1, 2, 3], [1, 2, 4], opts({ margin: 1, confidence: 0.4 }))).message).toMatch(/above 0.5/);
  });
  it('the data checks of the underlying t apply', () => {
    expect(statsError(() => pairedEquivalence([1], [2], opts({ margin: 1 }))).code).toBe('too-few');
    expect(statsError(() => pairedEquivalence([1.3, 2.4], [0.9, 2.0], opts({ margin: 1 }))).code).toBe('no-variation');
    expect(statsError(() => welchEquivalence([1, 2], [3, NaN], opts({ margin: 1 }))).code).toBe('not-finite');
  });
  it('enormous values and margin scale together', () => {
    const a = [30.2, 29.8, 30.5, 30.1, 29.9];
    const b = [30.0, 29.9, 30.1, 30.3, 29.8];
    const ref = pairedEquivalence(a, b, opts({ margin: 0.4 }));
    const big = pairedEquivalence(a.map((v) => v * 1e300), b.map((v) => v * 1e300), opts({ margin: 0.4e300 }));
    close(big.pValue, ref.pValue, 1e-10, 'p at 1e300');
    close(big.ci[1], ref.ci[1] * 1e300, 1e-12, 'upper end at 1e300');
    expect(big.details.intervalInsideMargin).toBe(ref.details.intervalInsideMargin);
  });
});
