/** Effect sizes: formula against design, and value against the other reported numbers. */
import { describe, expect, it } from 'vitest';
import { audit, codes, rec, reference } from './helpers.js';

describe('effect size formula', () => {
  it('a pooled-SD d with a paired test, formula not stated: warning', () => {
    const f = audit(rec('procedure: paired-t\neffectSize: {name: "Cohen\'s d", value: 0.28, formula: d-pooled, formulaStated: false}')).findings.find((x) => x.code === 'effect-size-formula')!;
    expect(f.severity).toBe('warning');
    expect(f.fix).toMatch(/d_z/);
  });
  it('the same, with the formula stated: no warning', () => {
    expect(codes(audit(rec('procedure: paired-t\neffectSize: {value: 0.28, formula: d-av, formulaStated: true}')))).not.toContain('effect-size-formula');
  });
  it('d_z for independent groups is an error', () => {
    expect(codes(audit(rec('procedure: welch-t\neffectSize: {value: 0.9, formula: d-z}')))).toContain('effect-size-dz-independent');
  });
  it('an effect size without a formula is a note', () => {
    expect(codes(audit(rec('procedure: paired-t\neffectSize: {name: d, value: 0.6}')))).toContain('effect-size-unnamed');
  });
});

describe('effect size value', () => {
  it('d_z = t / sqrt(pairs) (kiln glaze: t 2.22505, 12 pairs, d_z 0.642316, scipy)', () => {
    expect(codes(audit(rec('procedure: paired-t\nn: 12\nstatistic: 2.225\neffectSize: {value: 0.642, formula: d-z}')))).not.toContain('effect-size-inconsistent');
    expect(codes(audit(rec('procedure: paired-t\nn: 12\nstatistic: 2.225\neffectSize: {value: 0.84, formula: d-z}')))).toContain('effect-size-inconsistent');
  });
  it('a magnitude reported without its sign is accepted', () => {
    expect(codes(audit(rec('procedure: paired-t\nn: 12\nstatistic: -2.225\neffectSize: {value: 0.642, formula: d-z}')))).not.toContain('effect-size-inconsistent');
  });
  it("d_av from the group means and SDs (bond case: 0.278718, scipy)", () => {
    const g = 'groups:\n  - {mean: 14.2428, sd: 2.5333}\n  - {mean: 13.5806, sd: 2.21862}';
    expect(codes(audit(rec(`procedure: paired-t\neffectSize: {value: 0.279, formula: d-av, formulaStated: true}\n${g}`)))).not.toContain('effect-size-inconsistent');
  });
  it("Hedges' g from a pooled t (scipy fixture, exact J)", () => {
    const p = reference.analyses.find((a) => a.name === 'pooled')!;
    const r = rec(`procedure: pooled-t\nn1: ${p.n1}\nn2: ${p.n2}\nstatistic: ${p.statistic.toPrecision(6)}\neffectSize: {value: ${p.hedgesG.toPrecision(4)}, formula: hedges-g}`);
    expect(codes(audit(r))).not.toContain('effect-size-inconsistent');
  });
});
