/**
 * Welch two-sample t: scipy fixtures, @stdlib/stats-ttest2, published examples, bad input.
 */
import ttest2 from '@stdlib/stats-ttest2';
import { describe, expect, it } from 'vitest';
import { welchT } from '../../src/stats/welch-t.js';
import { hedgesJ } from '../../src/stats/effect-size.js';
import { ALTS, close, closeCi, opts, scipy, SCIPY, statsError } from './t-family-support.js';
import { AUTO83B_JAPAN, AUTO83B_US } from './t-published-data.js';

describe('Welch t against scipy fixtures', () => {
  for (const f of scipy.independent) {
    it(`${f.name} (n = ${f.first.length} and ${f.second.length})`, () => {
      for (const alt of ALTS) {
        const r = welchT(f.first, f.second, opts({ alternative: alt, confidence: f.confidence, nullValue: f.nullValue }));
        const want = f.welch[alt];
        const label = `${f.name} ${alt} vs ${SCIPY}`;
        close(r.statistic, want.statistic, 1e-10, `${label} t`);
        close(r.df!, want.df, 1e-11, `${label} Welch-Satterthwaite df`);
        close(r.pValue, want.pValue, 1e-9, `${label} p`);
        closeCi(r.ci, want.ci, 1e-10, `${label} interval`, Math.abs(f.estimate) + 1e-3);
        close(r.estimate, f.estimate, 1e-12, `${label} estimate`, 1e-12);
        close(r.effectSize!.value, f.hedgesG.value, 1e-11, `${label} Hedges' g`);
        closeCi(r.effectSize!.ci!, f.hedgesG.ci[alt], 1e-8, `${label} g interval (noncentral t inversion)`, 1e-3);
      }
    });
  }

  it('covers fractional df and p-values below 1e-12', () => {
    expect(scipy.independent.some((f) => !Number.isInteger(f.welch['two-sided'].df))).toBe(true);
    expect(scipy.independent.some((f) => f.welch['two-sided'].pValue < 1e-12)).toBe(true);
  });
});

describe('Welch t against @stdlib/stats-ttest2', () => {
  const cases = scipy.independent.filter((f) => f.welch['two-sided'].pValue > 1e-6);
  for (const f of cases) {
    it(`${f.name}: all alternatives`, () => {
      for (const alt of ALTS) {
        const r = welchT(f.first, f.second, opts({ alternative: alt, confidence: f.confidence, nullValue: f.nullValue }));
        const ref = ttest2(f.first, f.second, { alternative: alt, alpha: 1 - f.confidence, difference: f.nullValue, variance: 'unequal' });
        close(r.statistic, ref.statistic, 1e-10, `${f.name} ${alt} t vs stdlib`);
        close(r.df!, ref.df, 1e-11, `${f.name} ${alt} df vs stdlib`);
        close(r.pValue, ref.pValue, 1e-8, `${f.name} ${alt} p vs stdlib`, 1e-7);
        closeCi(r.ci, [ref.ci[0], ref.ci[1]], 1e-9, `${f.name} ${alt} interval vs stdlib`, 1);
        close(r.details.meanFirst as number, ref.xmean, 1e-12, 'mean first vs stdlib');
        close(r.details.meanSecond as number, ref.ymean, 1e-12, 'mean second vs stdlib');
      }
    });
  }
});

describe('Welch t: published worked examples', () => {
  it('Student (1908) sleep data read as two groups (R t.test documentation values, from memory)', () => {
    const g1 = [0.7, -1.6, -0.2, -1.2, -0.1, 3.4, 3.7, 0.8, 0.0, 2.0];
    const g2 = [1.9, 0.8, 1.1, 0.1, -0.1, 4.4, 5.5, 1.6, 4.6, 3.4];
    const r = welchT(g1, g2, opts());
    close(r.statistic, -1.8608, 5e-5, 'sleep Welch t');
    close(r.df!, 17.776, 1e-4, 'sleep Welch df');
    close(r.pValue, 0.07939, 1e-4, 'sleep Welch p');
    // R prints the interval as -3.3654832 0.2054832.
    close(r.ci[0], -3.3654832, 5e-8, 'sleep Welch interval lower');
    close(r.ci[1], 0.2054832, 5e-7, 'sleep Welch interval upper');
  });

  it('NIST/SEMATECH e-Handbook 1.3.5.3, AUTO83B with unequal variances (Dataplot output: T = -12.94627, df 136.8750; from memory)', () => {
    const r = welchT(AUTO83B_US, AUTO83B_JAPAN, opts());
    close(r.statistic, -12.94627, 5e-7, 'AUTO83B Welch T');
    close(r.df!, 136.875, 1e-5, 'AUTO83B Welch df');
    expect(r.pValue).toBeLessThan(1e-20);
  });
});

describe("Hedges' g", () => {
  it('uses the exact J, close to 1 - 3/(4 df - 1) (Hedges 1981)', () => {
    for (const df of [2, 5, 10, 38, 200]) {
      close(hedgesJ(df), 1 - 3 / (4 * df - 1), df < 5 ? 2e-2 : 2e-3, `J(${df}) vs approximation`);
    }
    // Exact values: J(2) = Gamma(1)/(1 * Gamma(1/2)) = 1/sqrt(pi); J(4) = Gamma(2)/(sqrt(2) Gamma(3/2)) = sqrt(2/pi).
    close(hedgesJ(2), 1 / Math.sqrt(Math.PI), 1e-14, 'J(2)');
    close(hedgesJ(4), Math.sqrt(2 / Math.PI), 1e-14, 'J(4)');
  });
  it('matches the fixture J and d', () => {
    for (const f of scipy.independent) {
      const df = f.first.length + f.second.length - 2;
      close(hedgesJ(df), f.hedgesG.J, 1e-13, `${f.name} J`);
    }
  });
});

describe('Welch t: bad input on purpose', () => {
  it('a group of one is too few for Welch', () => {
    const e = statsError(() => welchT([1], [2, 3, 4], opts()));
    expect(e.code).toBe('too-few');
    expect(e.message).toMatch(/first group: needs at least 2, got 1/);
  });
  it('NaN and Infinity are named with group and position', () => {
    expect(statsError(() => welchT([1, 2], [3, Infinity, 5], opts())).message).toMatch(/second group: value #2 is Infinity/);
    expect(statsError(() => welchT([NaN, 2], [3, 4], opts())).code).toBe('not-finite');
  });
  it('both groups constant: no-variation', () => {
    const e = statsError(() => welchT([4, 4, 4], [6, 6], opts()));
    expect(e.code).toBe('no-variation');
    expect(e.message).toMatch(/both groups are constant .*: the t statistic is undefined/);
  });
  it('one constant group: computed, with df from the other group and a note', () => {
    const r = welchT([4, 4, 4], [5.1, 6.3, 5.7, 6.0], opts());
    expect(r.df).toBeCloseTo(3, 12);
    expect(r.notes.join(' ')).toMatch(/first group shows no variation/);
  });
  it('enormous values: scale-stable, no NaN', () => {
    const a = [3.1, 2.2, 4.8, 3.9, 4.1];
    const b = [2.0, 1.5, 2.9, 2.2];
    const ref = welchT(a, b, opts());
    for (const k of [1e300, 1e-300]) {
      const r = welchT(a.map((v) => v * k), b.map((v) => v * k), opts());
      close(r.statistic, ref.statistic, 1e-12, `t at scale ${k}`);
      close(r.df!, ref.df!, 1e-12, `df at scale ${k}`);
      close(r.pValue, ref.pValue, 1e-10, `p at scale ${k}`);
      close(r.ci[1], ref.ci[1] * k, 1e-12, `upper end at scale ${k}`);
    }
  });
});
