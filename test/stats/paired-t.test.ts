/**
 * Paired t: against scipy fixtures, against @stdlib/stats-ttest, against published worked
 * examples, and on bad input on purpose.
 */
import ttest from '@stdlib/stats-ttest';
import { describe, expect, it } from 'vitest';
import { pairedT } from '../../src/stats/paired-t.js';
import { runProcedure } from '../../src/stats/index.js';
import { ALTS, close, closeCi, opts, scipy, SCIPY, statsError } from './t-family-support.js';

describe('paired t against scipy fixtures', () => {
  for (const f of scipy.paired) {
    it(`${f.name} (n = ${f.first.length})`, () => {
      for (const alt of ALTS) {
        const r = pairedT(f.first, f.second, opts({ alternative: alt, confidence: f.confidence, nullValue: f.nullValue }));
        const want = f.results[alt];
        const label = `${f.name} ${alt} vs ${SCIPY}`;
        close(r.statistic, want.statistic, 1e-10, `${label} t`);
        expect(r.df).toBe(want.df);
        // p-values: 1e-9 relative everywhere, including p near 1e-15 (issue 3 asks for 6 digits down to 1e-12).
        close(r.pValue, want.pValue, 1e-9, `${label} p`);
        closeCi(r.ci, want.ci, 1e-10, `${label} interval`, Math.abs(f.estimate) + 1e-3 * Math.abs(r.details.se as number));
        close(r.estimate, f.estimate, 1e-12, `${label} estimate`, 1e-12);
        close(r.details.sdDifferences as number, f.sdDifferences, 1e-12, `${label} sd of differences`);
        close(r.effectSize!.value, f.dz.value, 1e-12, `${label} d_z`);
        closeCi(r.effectSize!.ci!, f.dz.ci[alt], 1e-8, `${label} d_z interval (noncentral t inversion)`, 1e-3);
        expect(r.alternative).toBe(alt);
        expect(r.confidence).toBe(f.confidence);
        expect(r.n.pairs).toBe(f.first.length);
      }
    });
  }

  it('holds a tiny p-value to 6+ digits: the fixture goes below 1e-12', () => {
    const tiny = scipy.paired.filter((f) => f.results['two-sided'].pValue < 1e-12);
    expect(tiny.length).toBeGreaterThan(0);
  });
});

describe('paired t against @stdlib/stats-ttest', () => {
  // stdlib computes one-sided p as 1 - F (fine at these moderate p-values), so compare there.
  const cases = scipy.paired.filter((f) => f.nullValue === 0 && f.results['two-sided'].pValue > 1e-6);
  for (const f of cases) {
    for (const alt of ALTS) {
      it(`${f.name}, ${alt}: paired via x and y, and one-sample on the differences`, () => {
        const r = pairedT(f.first, f.second, opts({ alternative: alt, confidence: f.confidence }));
        const viaPairs = ttest(f.first, f.second, { alternative: alt, alpha: 1 - f.confidence });
        const d = f.first.map((v, i) => v - f.second[i]);
        const oneSample = ttest(d, { alternative: alt, alpha: 1 - f.confidence });
        for (const ref of [viaPairs, oneSample]) {
          close(r.statistic, ref.statistic, 1e-10, `${f.name} ${alt} t vs stdlib`);
          expect(r.df).toBe(ref.df);
          close(r.pValue, ref.pValue, 1e-8, `${f.name} ${alt} p vs stdlib`, 1e-7);
          closeCi(r.ci, [ref.ci[0], ref.ci[1]], 1e-9, `${f.name} ${alt} interval vs stdlib`, 1);
          close(r.estimate, ref.mean, 1e-12, `${f.name} ${alt} mean vs stdlib`, 1e-12);
        }
      });
    }
  }
});

describe('paired t: published worked examples', () => {
  it('Student (1908), Biometrika 6: Cushny and Peebles (1905) sleep data, drug 1 minus drug 2', () => {
    const drug1 = [0.7, -1.6, -0.2, -1.2, -0.1, 3.4, 3.7, 0.8, 0.0, 2.0];
    const drug2 = [1.9, 0.8, 1.1, 0.1, -0.1, 4.4, 5.5, 1.6, 4.6, 3.4];
    const r = pairedT(drug1, drug2, opts());
    // Published: mean difference 1.58 (drug 2 over drug 1). The t, p and interval below are the
    // widely reproduced values of R's t.test on these data (from memory; the scipy fixture agrees).
    close(r.estimate, -1.58, 1e-12, 'Student 1908 mean difference');
    close(r.statistic, -4.0621, 2e-5, 'Student 1908 t');
    expect(r.df).toBe(9);
    close(r.pValue, 0.002833, 2e-4, 'Student 1908 p');
    close(r.ci[0], -2.4598858, 1e-7, 'Student 1908 interval lower');
    close(r.ci[1], -0.7001142, 1e-7, 'Student 1908 interval upper');
  });

  it("Fisher (1935), The Design of Experiments, ch. III: Darwin's Zea mays, crossed minus self-fertilised", () => {
    // Differences in eighths of an inch for 15 pairs grown in the same pot; Fisher reports
    // t = 2.148 on 14 degrees of freedom, just beyond the 5% point (values from memory).
    const diffs = [49, -67, 8, 16, 6, 23, 28, 41, 14, 29, 56, 24, 75, 60, -48];
    const r = pairedT(diffs, diffs.map(() => 0), opts());
    close(r.estimate, 314 / 15, 1e-12, 'Fisher 1935 mean difference (sum 314)');
    close(r.statistic, 2.148, 5e-4, 'Fisher 1935 t');
    expect(r.df).toBe(14);
    expect(r.pValue).toBeGreaterThan(0.045);
    expect(r.pValue).toBeLessThan(0.05);
  });
});

describe('paired t: details and registry', () => {
  it('reports condition means, SDs, the SD of the differences, the standard error and d_z', () => {
    const first = [12.1, 13.4, 11.8, 14.0, 12.9];
    const second = [11.0, 12.9, 11.1, 13.1, 12.5];
    const r = runProcedure('paired-t', { kind: 'paired', first, second });
    expect(r.procedure).toBe('paired-t');
    close(r.details.meanFirst as number, 64.2 / 5, 1e-12, 'mean first');
    close(r.details.meanSecond as number, 60.6 / 5, 1e-12, 'mean second');
    close(r.details.se as number, (r.details.sdDifferences as number) / Math.sqrt(5), 1e-12, 'se');
    expect(r.effectSize!.name).toBe('d_z');
    expect(r.effectSize!.formula).toMatch(/mean of the differences \/ SD of the differences/);
    expect(r.notes).toEqual([]);
  });

  it('one-sided alternatives give a one-sided bound and say so', () => {
    const first = [5.1, 6.2, 5.8, 6.6, 5.9, 6.4];
    const second = [4.9, 5.5, 5.9, 6.0, 5.2, 6.1];
    const g = pairedT(first, second, opts({ alternative: 'greater' }));
    expect(g.ci[1]).toBe(Infinity);
    expect(g.effectSize!.ci![1]).toBe(Infinity);
    expect(g.notes.join(' ')).toMatch(/lower confidence bound/);
    const l = pairedT(first, second, opts({ alternative: 'less' }));
    expect(l.ci[0]).toBe(-Infinity);
    expect(l.notes.join(' ')).toMatch(/upper confidence bound/);
  });
});

describe('paired t: bad input on purpose', () => {
  it('a single pair is too few', () => {
    const e = statsError(() => pairedT([3], [2], opts()));
    expect(e.code).toBe('too-few');
    expect(e.message).toMatch(/at least 2, got 1/);
  });
  it('no pairs at all', () => {
    expect(statsError(() => pairedT([], [], opts())).code).toBe('too-few');
  });
  it('unequal lengths name both counts', () => {
    const e = statsError(() => pairedT([1, 2, 3], [1, 2], opts()));
    expect(e.code).toBe('invalid-option');
    expect(e.message).toMatch(/3 values and the second 2/);
  });
  it('NaN and Infinity are named with their position', () => {
    const e1 = statsError(() => pairedT([1, NaN, 3], [1, 2, 3], opts()));
    expect(e1.code).toBe('not-finite');
    expect(e1.message).toMatch(/first condition: value #2 is NaN/);
    const e2 = statsError(() => pairedT([1, 2, 3], [1, 2, -Infinity], opts()));
    expect(e2.message).toMatch(/second condition: value #3 is -Infinity/);
  });
  it('all differences equal: no-variation, saying what it means (also through decimal rounding)', () => {
    // 1.3 - 0.9, 2.4 - 2.0, 5.1 - 4.7 are not bit-identical in binary, yet all are 0.4.
    const e = statsError(() => pairedT([1.3, 2.4, 5.1, 7.7], [0.9, 2.0, 4.7, 7.3], opts()));
    expect(e.code).toBe('no-variation');
    expect(e.message).toBe(
      'all differences are equal (every difference is 0.4): the t statistic is undefined; the data show no variation to test against',
    );
    expect(statsError(() => pairedT([2, 2, 2], [2, 2, 2], opts())).message).toMatch(/every difference is 0\)/);
  });
  it('enormous values: no overflow, and the same t and p as the data at ordinary scale', () => {
    const base1 = [1.2, 3.4, 2.2, 5.1, 4.4, 3.9];
    const base2 = [1.0, 2.9, 2.5, 4.0, 4.1, 3.0];
    const ref = pairedT(base1, base2, opts());
    for (const k of [1e300, -1e300, 1e-300, 1.7e308 / 6]) {
      const r = pairedT(base1.map((v) => v * k), base2.map((v) => v * k), opts());
      expect(Number.isFinite(r.statistic) && Number.isFinite(r.pValue) && r.ci.every(Number.isFinite)).toBe(true);
      close(r.statistic, Math.sign(k) * ref.statistic, 1e-12, `t at scale ${k}`);
      close(r.pValue, ref.pValue, 1e-10, `p at scale ${k}`);
      close(r.estimate, ref.estimate * k, 1e-12, `estimate at scale ${k}`);
      close(r.effectSize!.value, Math.sign(k) * ref.effectSize!.value, 1e-12, `d_z at scale ${k}`);
    }
  });
  it('subnormal values (around 1e-310): rescaled, same t and p up to their reduced precision', () => {
    const a = [1.2, 3.4, 2.2, 5.1, 4.4, 3.9];
    const b = [1.0, 2.9, 2.5, 4.0, 4.1, 3.0];
    const ref = pairedT(a, b, opts());
    const r = pairedT(a.map((v) => v * 1e-310), b.map((v) => v * 1e-310), opts());
    close(r.statistic, ref.statistic, 1e-9, 't at 1e-310');
    close(r.pValue, ref.pValue, 1e-9, 'p at 1e-310');
  });
  it('differences beyond double range are a clear error, not Infinity or NaN', () => {
    const e = statsError(() => pairedT([1.7e308, 1.6e308, 1.5e308], [-1.7e308, -1.5e308, -1.6e308], opts()));
    expect(e.code).toBe('not-finite');
    expect(e.message).toMatch(/exceeds the range of double-precision numbers/);
  });
});
