/**
 * The audit's recomputations against scipy (fixtures from test/fixtures/scipy-audit/generate.py,
 * Debian python3-scipy; version in the JSON): tail p-values by alternative, t quantiles for the
 * interval, Welch-Satterthwaite df, Hedges' J and the two one-sided p-values of an equivalence test.
 */
import { describe, expect, it } from 'vitest';
import { pRange, criticalRange } from '../../src/audit/recompute.js';
import { welchDf } from '../../src/audit/check-counts.js';
import { hedgesJ } from '../../src/audit/check-effect-size.js';
import { parseReported } from '../../src/audit/digits.js';
import { tCdf, tSf } from '../../src/stats/distributions.js';
import { reference } from './helpers.js';

function near(got: number, want: number, rel: number): void {
  const diff = Math.abs(got - want);
  const tol = rel * Math.max(Math.abs(want), 1e-300);
  if (diff > tol) throw new Error(`value ${got}, expected ${want}, difference ${diff}, tolerance ${tol}`);
}

describe(`p-values from a statistic, against scipy ${reference.library.scipy}`, () => {
  for (const row of reference.pvalues) {
    it(`${row.dist} ${row.stat}${row.df !== null ? ` df ${row.df}` : ''} ${row.alternative} -> ${row.p.toPrecision(6)}`, () => {
      const ref = row.dist === 't' ? { kind: 't' as const, df: [row.df!, row.df!] as [number, number], dfText: '' } : row.dist === 'normal' ? { kind: 'normal' as const } : { kind: 'chisq1' as const };
      const [lo, hi] = pRange(ref, [row.stat, row.stat], row.alternative);
      near(lo, row.p, 1e-9);
      near(hi, row.p, 1e-9);
    });
  }
  it('a rounded statistic gives a range that holds the exact p (t = 2.14 written, df 23)', () => {
    const [lo, hi] = pRange({ kind: 't', df: [23, 23], dfText: '23' }, [2.135, 2.145], 'two-sided');
    const exact = reference.pvalues.find((r) => r.dist === 't' && r.stat === 2.14 && r.df === 23 && r.alternative === 'two-sided')!.p;
    expect(lo).toBeLessThan(exact);
    expect(hi).toBeGreaterThan(exact);
  });
  it('a statistic range crossing zero reaches p = 1 two-sided', () => {
    expect(pRange({ kind: 'normal' }, [-0.05, 0.05], 'two-sided')[1]).toBe(1);
  });
});

describe('t quantiles for intervals, against scipy', () => {
  for (const row of reference.quantiles) {
    it(`t quantile p ${row.p} df ${row.df}`, () => {
      const oneSided = row.p !== 0.975 && row.p !== 0.995;
      const level = oneSided ? row.p : 1 - 2 * (1 - row.p);
      const [lo] = criticalRange({ kind: 't', df: [row.df, row.df], dfText: '' }, level, oneSided);
      near(lo, row.q, 1e-9);
    });
  }
});

describe('Welch-Satterthwaite df, Hedges J and TOST p-values, against scipy', () => {
  for (const w of reference.welch) {
    it(`Welch df for SDs ${w.s1}, ${w.s2}, n ${w.n1}, ${w.n2}`, () => {
      const s1 = parseReported(String(w.s1));
      const s2 = parseReported(String(w.s2));
      if (!s1.ok || !s2.ok) throw new Error('parse');
      // Exact SDs: zero the rounding so the range collapses to the value.
      s1.number.halfUnit = 0;
      s2.number.halfUnit = 0;
      const [lo, hi] = welchDf(s1.number, s2.number, w.n1, w.n2);
      near(lo, w.df, 1e-12);
      near(hi, w.df, 1e-12);
    });
  }
  for (const h of reference.hedges) {
    it(`Hedges J(${h.df})`, () => near(hedgesJ(h.df), h.J, 1e-12));
  }
  for (const t of reference.tost) {
    it(`TOST p-values for estimate ${t.estimate}, SE ${t.se}, df ${t.df}, margin ${t.margin}`, () => {
      near(tSf((t.estimate + t.margin) / t.se, t.df), t.pLower, 1e-9);
      near(tCdf((t.estimate - t.margin) / t.se, t.df), t.pUpper, 1e-9);
    });
  }
});
