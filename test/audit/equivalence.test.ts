/** Equivalence decisions (two one-sided tests) and "no difference" claims. */
import { describe, expect, it } from 'vitest';
import { audit, codes, rec, recommendation } from './helpers.js';

// loggers case (scipy): estimate 0.3075, se 0.117929, df 19, margin 0.5: pLower 7.785e-07, pUpper 0.0595361,
// 90% interval 0.103585 to 0.511415.
const base = 'procedure: paired-equivalence\ndifference: {first: logger K, second: logger J}\nn: 20\ndf: 19\nestimate: 0.3075\nse: 0.1179\n';

describe('equivalence', () => {
  it('deciding on the smaller one-sided p is an error that names the larger', () => {
    const r = audit(rec(base + 'equivalence: {margin: 0.5, pLower: "< 0.001", pUpper: 0.060, decisionP: "< 0.001", decision: equivalent}'));
    const f = r.findings.find((x) => x.code === 'equivalence-smaller-p')!;
    expect(f.severity).toBe('error');
    expect(f.fix).toMatch(/0\.060/);
  });
  it('equivalent claimed although the larger p is above alpha (no decision p given)', () => {
    expect(codes(audit(rec(base + 'equivalence: {margin: 0.5, pLower: 0.0000008, pUpper: 0.060, decision: equivalent}')))).toContain('equivalence-smaller-p');
  });
  it('a correct decision passes, and both one-sided p-values are recomputed', () => {
    const r = audit(rec(base + 'equivalence: {margin: 0.5, pLower: 0.0000008, pUpper: 0.060, decision: not-equivalent}'));
    expect(codes(r).filter((c) => c.startsWith('equivalence') || c === 'p-inconsistent')).toEqual([]);
    expect(r.checks.filter((c) => c.what.startsWith('one-sided p')).every((c) => c.ok)).toBe(true);
  });
  it('a one-sided p that does not follow from estimate, SE and margin', () => {
    expect(codes(audit(rec(base + 'equivalence: {margin: 0.5, pLower: 0.0000008, pUpper: 0.030}')))).toContain('p-inconsistent');
  });
  it('the interval reaching beyond the margin contradicts "equivalent"', () => {
    const r = audit(rec(base + 'ci: {lower: 0.104, upper: 0.511, level: 90%}\nequivalence: {margin: 0.5, decision: equivalent}'));
    expect(codes(r)).toContain('equivalence-decision');
  });
  it('equivalence without a margin', () => {
    expect(codes(audit(rec('procedure: paired-equivalence\nequivalence: {decision: equivalent}')))).toContain('equivalence-no-margin');
  });
  it('the margin may come from the study facts', () => {
    const r = audit(rec('procedure: paired-equivalence\nequivalence: {decision: equivalent}'), recommendation('paired', 'repeated-measures', 'paired-equivalence', { margin: 0.5 }));
    expect(codes(r)).not.toContain('equivalence-no-margin');
  });
});

describe('absence of evidence', () => {
  it('"no difference" from a non-significant test of difference is a warning', () => {
    const f = audit(rec('procedure: welch-t\npValue: 0.145\nclaim: no-difference')).findings.find((x) => x.code === 'absence-as-equivalence')!;
    expect(f.severity).toBe('warning');
    expect(f.fix).toMatch(/equivalence test/);
  });
  it('"equivalent" from a test of difference, without a margin', () => {
    expect(codes(audit(rec('procedure: welch-t\npValue: 0.6\nclaim: equivalent')))).toEqual(expect.arrayContaining(['absence-as-equivalence', 'equivalence-no-margin']));
  });
});

describe('the level of an equivalence test', () => {
  it('a 90% interval goes with alpha = 0.05 (1 - 2 alpha), and the messages say so', () => {
    const r = audit(rec(base + 'ci: {lower: 0.104, upper: 0.511, level: 90%}\nequivalence: {margin: 0.5, pLower: "< 0.001", pUpper: 0.060, decision: equivalent}'));
    const f = r.findings.find((x) => x.code === 'equivalence-smaller-p')!;
    expect(f.message).toMatch(/at 0\.05 it does not show equivalence/);
    expect(f.fix).toMatch(/90% interval/);
  });
});
