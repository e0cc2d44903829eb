/**
 * Digit-based tolerance, end to end: complete analyses computed by scipy (fixtures) are written
 * with every number rounded to k significant digits, as a colleague would copy them. However few
 * digits are kept, the audit must not call them inconsistent; and a number moved by a few units in
 * its last place beyond its rounding must be caught.
 */
import { describe, expect, it } from 'vitest';
import { audit, codes, rec, reference } from './helpers.js';

const NUMERIC = ['p-inconsistent', 'p-other-sidedness', 'df-inconsistent', 'ci-inconsistent', 'ci-p-disagree', 'statistic-inconsistent', 'estimate-inconsistent', 'effect-size-inconsistent', 'statistic-estimate-sign', 'ci-excludes-estimate', 'sign-vs-direction'];

const sig = (x: number, k: number): string => {
  const s = x.toPrecision(k);
  return s.includes('e') ? s : s;
};
const a = (name: string) => reference.analyses.find((x) => x.name === name)!;

function pairedRecord(k: number, over: Record<string, string> = {}): string {
  const p = a('paired');
  const f = { n: String(p.n), df: String(p.df), statistic: sig(p.statistic, k), pValue: sig(p.pValue, k), estimate: sig(p.estimate, k), sd: sig(p.sd, k), lower: sig(p.lower, k), upper: sig(p.upper, k), dz: sig(p.dz, k), m1: sig(p.groups[0].mean, k + 2), m2: sig(p.groups[1].mean, k + 2), ...over };
  return rec(`procedure: paired-t
difference: {first: nozzle B, second: nozzle A}
alternative: two-sided
n: ${f.n}
df: ${f.df}
statistic: ${f.statistic}
pValue: ${f.pValue}
estimate: ${f.estimate}
sd: ${f.sd}
ci: {lower: ${f.lower}, upper: ${f.upper}, level: 95%}
effectSize: {name: d_z, value: ${f.dz}, formula: d-z, formulaStated: true}
groups:
  - {label: nozzle B, mean: ${f.m1}}
  - {label: nozzle A, mean: ${f.m2}}`);
}

function welchRecord(k: number, over: Record<string, string> = {}): string {
  const w = a('welch');
  const f = { df: sig(w.df, k), statistic: sig(w.statistic, k), pValue: sig(w.pValue, k), estimate: sig(w.estimate, k), lower: sig(w.lower, k), upper: sig(w.upper, k), s1: sig(w.groups[0].sd, k + 1), s2: sig(w.groups[1].sd, k + 1), m1: sig(w.groups[0].mean, k + 2), m2: sig(w.groups[1].mean, k + 2), ...over };
  return rec(`procedure: Welch's unequal-variances t
difference: {first: batch K, second: batch L}
n1: ${w.n1}
n2: ${w.n2}
df: ${f.df}
statistic: ${f.statistic}
pValue: ${f.pValue}
estimate: ${f.estimate}
ci: {lower: ${f.lower}, upper: ${f.upper}}
groups:
  - {label: batch K, mean: ${f.m1}, sd: ${f.s1}}
  - {label: batch L, mean: ${f.m2}, sd: ${f.s2}}`);
}

function pooledRecord(k: number, over: Record<string, string> = {}): string {
  const p = a('pooled');
  const f = { statistic: sig(p.statistic, k), pValue: sig(p.pValue, k), estimate: sig(p.estimate, k), lower: sig(p.lower, k), upper: sig(p.upper, k), g: sig(p.hedgesG, k), ...over };
  return rec(`procedure: pooled-t
difference: {first: schedule 1, second: schedule 2}
n1: ${p.n1}
n2: ${p.n2}
df: ${p.df}
statistic: ${f.statistic}
pValue: ${f.pValue}
estimate: ${f.estimate}
ci: {lower: ${f.lower}, upper: ${f.upper}, level: 0.90}
effectSize: {name: g, value: ${f.g}, formula: hedges-g, formulaStated: true}`);
}

describe('consistent numbers rounded to any number of digits pass', () => {
  for (const k of [2, 3, 4, 5, 6, 8]) {
    it(`paired analysis, ${k} significant digits`, () => {
      const found = codes(audit(pairedRecord(k)));
      expect(found.filter((c) => NUMERIC.includes(c))).toEqual([]);
    });
    it(`Welch analysis, ${k} significant digits`, () => {
      const found = codes(audit(welchRecord(k)));
      expect(found.filter((c) => NUMERIC.includes(c))).toEqual([]);
    });
    it(`pooled analysis at 90%, ${k} significant digits`, () => {
      const found = codes(audit(pooledRecord(k)));
      expect(found.filter((c) => NUMERIC.includes(c))).toEqual([]);
    });
  }
});

describe('numbers moved beyond their rounding are caught', () => {
  it('a p-value off by 3 units in its 3rd digit', () => {
    const p = a('paired').pValue; // 0.02313
    expect(codes(audit(pairedRecord(4, { pValue: (Number(p.toPrecision(3)) + 0.0003).toFixed(4) })))).toContain('p-inconsistent');
  });
  it('the one-sided p written for a two-sided test', () => {
    expect(codes(audit(pairedRecord(4, { pValue: a('paired').pGreater.toPrecision(3) })))).toContain('p-other-sidedness');
  });
  it('df counted as observations minus 2 in the paired analysis', () => {
    expect(codes(audit(pairedRecord(4, { df: '24' })))).toContain('df-inconsistent');
  });
  it('an interval end moved by 0.05 (4 digits written)', () => {
    expect(codes(audit(pairedRecord(4, { upper: (Number(a('paired').upper.toPrecision(4)) + 0.05).toFixed(3) })))).toContain('ci-inconsistent');
  });
  it('a Welch df outside the Welch-Satterthwaite value for the reported SDs', () => {
    expect(codes(audit(welchRecord(4, { df: '24' })))).toContain('df-inconsistent');
  });
  it('the pooled d given where Hedges g is named: J matters at df 20 only beyond 3 digits', () => {
    expect(codes(audit(pooledRecord(6, { g: a('pooled').dPooled.toPrecision(6) })))).toContain('effect-size-inconsistent');
  });
  it('the statistic of a different SD', () => {
    expect(codes(audit(pairedRecord(4, { sd: (a('paired').sd * 1.3).toPrecision(4) })))).toContain('statistic-inconsistent');
  });
});
