/**
 * Pooled two-sample t: scipy fixtures, @stdlib/stats-ttest2, the NIST e-Handbook example, bad input.
 */
import ttest2 from '@stdlib/stats-ttest2';
import { describe, expect, it } from 'vitest';
import { pooledT } from '../../src/stats/pooled-t.js';
import { runProcedure } from '../../src/stats/index.js';
import { ALTS, close, closeCi, opts, scipy, SCIPY, statsError } from './t-family-support.js';
import { AUTO83B_JAPAN, AUTO83B_US } from './t-published-data.js';

describe('pooled t against scipy fixtures', () => {
  for (const f of scipy.independent) {
    it(`${f.name} (n = ${f.first.length} and ${f.second.length})`, () => {
      for (const alt of ALTS) {
        const r = pooledT(f.first, f.second, opts({ alternative: alt, confidence: f.confidence, nullValue: f.nullValue }));
        const want = f.pooled[alt];
        const label = `${f.name} ${alt} vs ${SCIPY}`;
        close(r.statistic, want.statistic, 1e-10, `${label} t`);
        expect(r.df).toBe(want.df);
        close(r.pValue, want.pValue, 1e-9, `${label} p`);
        closeCi(r.ci, want.ci, 1e-10, `${label} interval`, Math.abs(f.estimate) + 1e-3);
        close(r.effectSize!.value, f.hedgesG.value, 1e-11, `${label} Hedges' g`);
        closeCi(r.effectSize!.ci!, f.hedgesG.ci[alt], 1e-8, `${label} g interval`, 1e-3);
      }
    });
  }
});

describe('pooled t against @stdlib/stats-ttest2 (variance: equal)', () => {
  const cases = scipy.independent.filter((f) => f.pooled['two-sided'].pValue > 1e-6);
  for (const f of cases) {
    it(`${f.name}: all alternatives`, () => {
      for (const alt of ALTS) {
        const r = pooledT(f.first, f.second, opts({ alternative: alt, confidence: f.confidence, nullValue: f.nullValue }));
        const ref = ttest2(f.first, f.second, { alternative: alt, alpha: 1 - f.confidence, difference: f.nullValue, variance: 'equal' });
        close(r.statistic, ref.statistic, 1e-10, `${f.name} ${alt} t vs stdlib`);
        expect(r.df).toBe(ref.df);
        close(r.pValue, ref.pValue, 1e-8, `${f.name} ${alt} p vs stdlib`, 1e-7);
        closeCi(r.ci, [ref.ci[0], ref.ci[1]], 1e-9, `${f.name} ${alt} interval vs stdlib`, 1);
      }
    });
  }
});

describe('pooled t: published worked examples', () => {
  it('NIST/SEMATECH e-Handbook of Statistical Methods, section 1.3.5.3, AUTO83B (U.S. minus Japanese cars)', () => {
    const r = pooledT(AUTO83B_US, AUTO83B_JAPAN, opts());
    expect(r.n).toEqual({ first: 249, second: 79 });
    close(r.details.meanFirst as number, 20.14458, 5e-7, 'handbook mean 1');
    close(r.details.meanSecond as number, 30.48101, 5e-7, 'handbook mean 2');
    close(r.details.sdFirst as number, 6.4147, 5e-6, 'handbook SD 1');
    close(r.details.sdSecond as number, 6.10771, 5e-6, 'handbook SD 2');
    close(r.details.sdPooled as number, 6.3426, 5e-6, 'handbook pooled SD');
    close(r.statistic, -12.62059, 5e-7, 'handbook T');
    expect(r.df).toBe(326);
    // The handbook's critical value t(0.975, 326) = 1.9673: the interval half-width is 1.9673 se.
    close((r.ci[1] - r.ci[0]) / 2 / (r.details.se as number), 1.9673, 5e-5, 'handbook critical value');
    expect(r.pValue).toBeLessThan(1e-25);
  });

  it('Student (1908) sleep data as two groups, equal variances: t = -1.8608, df 18, p = 0.07919 (R t.test, from memory)', () => {
    const r = pooledT([0.7, -1.6, -0.2, -1.2, -0.1, 3.4, 3.7, 0.8, 0.0, 2.0], [1.9, 0.8, 1.1, 0.1, -0.1, 4.4, 5.5, 1.6, 4.6, 3.4], opts());
    close(r.statistic, -1.8608, 5e-5, 'sleep pooled t');
    expect(r.df).toBe(18);
    close(r.pValue, 0.07919, 1e-4, 'sleep pooled p');
  });
});

describe('pooled t: notes and bad input', () => {
  it('says that it assumes equal spreads, and reports the pooled SD', () => {
    const r = runProcedure('pooled-t', { kind: 'independent', first: [3.2, 4.1, 3.8], second: [2.9, 3.0, 3.6, 3.3] });
    expect(r.notes[0]).toMatch(/assumes both groups share one spread/);
    expect(typeof r.details.sdPooled).toBe('number');
  });
  it('a group of one is allowed (the other group carries the spread), but not two single values', () => {
    const r = pooledT([5], [3.1, 3.9, 3.4], opts());
    expect(r.df).toBe(2);
    expect(r.notes.join(' ')).toMatch(/first group has a single value/);
    expect(statsError(() => pooledT([5], [3], opts())).code).toBe('too-few');
    expect(statsError(() => pooledT([], [3, 4], opts())).code).toBe('too-few');
  });
  it('three values in all: computed, but no Hedges g (J undefined at 1 df), with a note', () => {
    const r = pooledT([5], [3.1, 3.9], opts());
    expect(r.df).toBe(1);
    expect(r.effectSize).toBeNull();
    expect(r.notes.join(' ')).toMatch(/no Hedges' g/);
  });
  it('both constant: no-variation; NaN: not-finite', () => {
    expect(statsError(() => pooledT([2, 2], [2, 2, 2], opts())).code).toBe('no-variation');
    expect(statsError(() => pooledT([2, NaN], [2, 3], opts())).code).toBe('not-finite');
  });
  it('enormous values: scale-stable', () => {
    const a = [7.5, 8.1, 6.9, 7.7];
    const b = [6.2, 6.8, 7.1, 6.0, 6.6];
    const ref = pooledT(a, b, opts());
    const r = pooledT(a.map((v) => v * 1e300), b.map((v) => v * 1e300), opts());
    close(r.statistic, ref.statistic, 1e-12, 't at 1e300');
    close(r.pValue, ref.pValue, 1e-10, 'p at 1e300');
    close(r.details.sdPooled as number, (ref.details.sdPooled as number) * 1e300, 1e-12, 'pooled SD at 1e300');
  });
});
