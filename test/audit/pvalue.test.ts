/** The p-value against the statistic, df and sidedness, with the tolerance from the written digits. */
import { describe, expect, it } from 'vitest';
import { audit, codes, rec } from './helpers.js';

describe('p-value recomputation', () => {
  // Student (1908), Biometrika 6, p. 20, as quoted in src/stats/paired-t.ts: t = 4.0621 on 9 df,
  // two-sided p = 0.002833. Written with fewer digits as a report would.
  it('a published worked example passes at the digits reported (Student 1908)', () => {
    expect(codes(audit(rec('procedure: paired-t\nn: 10\ndf: 9\nstatistic: 4.06\npValue: 0.0028')))).not.toContain('p-inconsistent');
    expect(codes(audit(rec('procedure: paired-t\nn: 10\ndf: 9\nstatistic: 4.0621\npValue: 0.002833')))).not.toContain('p-inconsistent');
  });
  it('trailing zeros count: "0.0430" is held to 4 decimals, "0.043" to 3', () => {
    // t = 2.14 on 23 df: two-sided p from 0.0429 to 0.0438 over t in [2.135, 2.145] (scipy fixture rows bracket it)
    expect(codes(audit(rec('procedure: paired-t\ndf: 23\nstatistic: 2.14\npValue: 0.043')))).not.toContain('p-inconsistent');
    expect(codes(audit(rec('procedure: paired-t\ndf: 23\nstatistic: 2.14\npValue: 0.0410')))).toContain('p-inconsistent');
    expect(codes(audit(rec('procedure: paired-t\ndf: 23\nstatistic: 2.140\npValue: 0.0440')))).toContain('p-inconsistent');
  });
  it('more digits in the statistic narrow the allowed p', () => {
    // t = 2.1 allows [2.05, 2.15]: p from 0.042 to 0.052; t = 2.100 allows only about 0.0469 to 0.0470
    expect(codes(audit(rec('procedure: paired-t\ndf: 23\nstatistic: 2.1\npValue: 0.050')))).not.toContain('p-inconsistent');
    expect(codes(audit(rec('procedure: paired-t\ndf: 23\nstatistic: 2.100\npValue: 0.050')))).toContain('p-inconsistent');
  });
  it('a bound such as "< 0.001" is checked as a bound', () => {
    expect(codes(audit(rec('procedure: paired-t\ndf: 10\nstatistic: 22.9\npValue: "< 0.001"')))).not.toContain('p-inconsistent');
    expect(codes(audit(rec('procedure: paired-t\ndf: 10\nstatistic: 1.9\npValue: "< 0.001"')))).toContain('p-inconsistent');
  });
  it('the one-sided p reported as two-sided, and the reverse', () => {
    const f = audit(rec('procedure: paired-t\nalternative: two-sided\ndf: 13\nstatistic: 1.79\npValue: 0.048')).findings.find((x) => x.code === 'p-other-sidedness')!;
    expect(f.message).toMatch(/one-sided p-value/);
    expect(codes(audit(rec('procedure: paired-t\ndifference: {first: a, second: b}\nalternative: greater\ndf: 13\nstatistic: 1.79\npValue: 0.096')))).toContain('p-other-sidedness');
  });
  it('with no alternative stated, two-sided is assumed and the message says so', () => {
    const f = audit(rec('procedure: paired-t\ndf: 13\nstatistic: 1.79\npValue: 0.048')).findings.find((x) => x.code === 'p-other-sidedness')!;
    expect(f.message).toMatch(/does not state the alternative/);
  });
  it('df taken from the counts when not reported', () => {
    expect(codes(audit(rec('procedure: paired-t\nn: 14\nstatistic: 1.79\npValue: 0.096')))).not.toContain('p-inconsistent');
    const r = audit(rec('procedure: paired-t\nn: 14\nstatistic: 1.79\npValue: 0.096'));
    expect(r.checks.find((c) => c.what.startsWith('p-value'))!.what).toMatch(/not reported/);
  });
  it('z and chi-square statistics use their own reference distributions', () => {
    // 2 P(Z > 1.96) = 0.0500; P(chi-square_1 > 3.84) = 0.0500 (scipy fixture rows)
    expect(codes(audit(rec('procedure: two-proportions\nstatisticName: z\nstatistic: 1.96\npValue: 0.050')))).not.toContain('p-inconsistent');
    expect(codes(audit(rec('procedure: mcnemar\nstatisticName: chi-square\nstatistic: 3.84\npValue: 0.050')))).not.toContain('p-inconsistent');
    expect(codes(audit(rec('procedure: mcnemar\nstatisticName: chi-square\nstatistic: 3.84\npValue: 0.025')))).toContain('p-inconsistent');
  });
  it('a rank statistic is not recomputed, and the check says why', () => {
    const r = audit(rec('procedure: signed-rank\nstatisticName: W\nstatistic: 12\npValue: 0.03'));
    expect(codes(r)).not.toContain('p-inconsistent');
    expect(r.checks[0].note).toMatch(/rank statistic/);
  });
  it('impossible and zero p-values', () => {
    expect(codes(audit(rec('pValue: 1.3')))).toContain('p-impossible');
    const r = audit(rec('procedure: paired-t\ndf: 10\nstatistic: 22.9\npValue: 0.000'));
    expect(codes(r)).toContain('p-written-as-zero');
    expect(codes(r)).not.toContain('p-inconsistent');
  });
});
