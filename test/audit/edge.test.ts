/** Edge cases on purpose: degenerate numbers give a clear finding or a "not recomputed" note, never NaN or a crash. */
import { describe, expect, it } from 'vitest';
import { audit, codes, rec } from './helpers.js';

const noNaN = (r: ReturnType<typeof audit>): void => {
  const text = JSON.stringify(r.findings) + JSON.stringify(r.checks.map((c) => ({ ...c, expected: c.expected ?? [] })));
  expect(text).not.toMatch(/NaN|undefined/);
};

describe('degenerate reports', () => {
  it('an empty report gives notes only and exit-worthy nothing', () => {
    const r = audit(rec('claim: inconclusive'));
    expect(r.findings.every((f) => f.severity === 'note')).toBe(true);
    noNaN(r);
  });
  it('df of zero: the p-value is not recomputed, and df is flagged against the counts', () => {
    const r = audit(rec('procedure: paired-t\nn: 5\ndf: 0\nstatistic: 2.1\npValue: 0.1'));
    expect(codes(r)).toContain('df-inconsistent');
    expect(codes(r)).not.toContain('p-inconsistent');
    expect(r.checks.find((c) => c.what.startsWith('p-value'))!.note).toMatch(/not positive/);
    noNaN(r);
  });
  it('a single pair: df = 0 is expected, so no p-value can be recomputed', () => {
    const r = audit(rec('procedure: paired-t\nn: 1\nstatistic: 2.1\npValue: 0.1'));
    expect(r.checks.find((c) => c.what.startsWith('p-value'))!.note).toMatch(/not positive/);
    noNaN(r);
  });
  it('a zero statistic with p = 1', () => {
    const r = audit(rec('procedure: paired-t\ndf: 9\nstatistic: 0\npValue: 1.000\nestimate: 0\nci: {lower: -1.2, upper: 1.2}'));
    expect(codes(r)).not.toContain('p-inconsistent');
    noNaN(r);
  });
  it('a huge statistic and a tiny bound', () => {
    const r = audit(rec('procedure: welch-t\nn1: 40\nn2: 40\ndf: 70.2\nstatistic: 45.1\npValue: "< 1e-16"'));
    expect(codes(r)).not.toContain('p-inconsistent');
  });
  it('an interval written upside down', () => {
    const r = audit(rec('procedure: paired-t\nestimate: 1.1\nci: {lower: 2.0, upper: 0.2}'));
    expect(r.findings.find((f) => f.code === 'ci-inconsistent')!.message).toMatch(/above its upper end/);
  });
  it('Welch with a group of one', () => {
    const r = audit(rec('procedure: welch-t\ndf: 3\ngroups:\n  - {n: 1, sd: 0}\n  - {n: 5, sd: 1.2}'));
    noNaN(r);
  });
});
