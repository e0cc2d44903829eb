/** Interval, statistic and estimate against each other (numbers from scipy, test/fixtures/scipy-audit/cases.json). */
import { describe, expect, it } from 'vitest';
import { audit, codes, rec } from './helpers.js';

// filament case (Welch): estimate 5.15128, se 1.11917, df 22.3281, t 4.60278;
// 95% interval 2.83225 to 7.47032; 90% interval 3.23075 to 7.07182.
const welch = (ci: string, extra = ''): string => rec(`procedure: welch-t\ndifference: {first: Arden, second: Brisk}\nn1: 12\nn2: 13\ndf: 22.3\nstatistic: 4.603\npValue: 0.000134\nestimate: 5.151\n${ci}${extra}`);

describe('interval against estimate, SE and level', () => {
  it('the 95% interval passes', () => {
    expect(codes(audit(welch('ci: {lower: 2.83, upper: 7.47, level: 95%}')))).not.toContain('ci-inconsistent');
  });
  it('a 90% interval labelled 95% is caught and the level named', () => {
    const f = audit(welch('ci: {lower: 3.23, upper: 7.07, level: 95%}')).findings.find((x) => x.code === 'ci-inconsistent')!;
    expect(f.message).toMatch(/matches a 90% level/);
  });
  it('an interval built with the normal quantile is named as such', () => {
    // 5.15128 -/+ 1.95996 * 1.11917 = 2.9578 to 7.3448
    const f = audit(welch('ci: {lower: 2.96, upper: 7.34}')).findings.find((x) => x.code === 'ci-inconsistent')!;
    expect(f.message).toMatch(/normal quantile/);
  });
  it('the SE from group SDs is used when given (and the statistic checked against it)', () => {
    const g = '\ngroups:\n  - {label: Arden, n: 12, mean: 48.77, sd: 2.426}\n  - {label: Brisk, n: 13, mean: 43.62, sd: 3.147}';
    const r = audit(welch('ci: {lower: 2.83, upper: 7.47}', g));
    expect(codes(r).filter((c) => /inconsistent/.test(c))).toEqual([]);
    expect(r.checks.some((c) => c.what.startsWith('statistic (estimate / SE'))).toBe(true);
  });
  it('the estimate outside its own interval', () => {
    expect(codes(audit(welch('ci: {lower: -7.47, upper: -2.83}')))).toContain('ci-excludes-estimate');
  });
  it('a one-sided bound with a one-sided alternative', () => {
    // one-sided 95% lower bound: 5.15128 - t(0.95, 22.33) * 1.11917 = 3.2307
    const r = rec('procedure: welch-t\ndifference: {first: Arden, second: Brisk}\nalternative: greater\nn1: 12\nn2: 13\ndf: 22.3\nstatistic: 4.603\nestimate: 5.151\nci: {lower: 3.23}');
    expect(codes(audit(r))).not.toContain('ci-inconsistent');
  });
});

describe('statistic, estimate and p agree', () => {
  it('statistic and estimate of opposite signs', () => {
    expect(codes(audit(rec('procedure: paired-t\ndf: 11\nstatistic: -2.23\nestimate: 2.19')))).toContain('statistic-estimate-sign');
  });
  it('a statistic that does not follow from the estimate and the SD of differences', () => {
    // kiln glaze: estimate 2.19167, sd 3.41213, n 12 -> t 2.22505
    expect(codes(audit(rec('procedure: paired-t\nn: 12\ndf: 11\nstatistic: 2.23\nestimate: 2.192\nsd: 3.412')))).not.toContain('statistic-inconsistent');
    expect(codes(audit(rec('procedure: paired-t\nn: 12\ndf: 11\nstatistic: 2.63\nestimate: 2.192\nsd: 3.412')))).toContain('statistic-inconsistent');
  });
  it('the estimate against the reported means, and a subtraction run the other way', () => {
    const g = 'groups:\n  - {label: B, mean: 88.23}\n  - {label: A, mean: 86.03}';
    expect(codes(audit(rec(`procedure: paired-t\ndifference: {first: B, second: A}\nestimate: 2.19\n${g}`)))).not.toContain('estimate-inconsistent');
    expect(codes(audit(rec(`procedure: paired-t\ndifference: {first: B, second: A}\nestimate: 2.9\n${g}`)))).toContain('estimate-inconsistent');
    expect(codes(audit(rec(`procedure: paired-t\ndifference: {first: B, second: A}\nestimate: -2.20\n${g}`)))).toContain('sign-vs-direction');
  });
  it('a two-sided interval and p-value that disagree about 0 (no statistic given)', () => {
    const r = audit(rec('procedure: paired-t\nn: 12\nestimate: 2.19\nse: 0.985\npValue: 0.21\nci: {lower: 0.02, upper: 4.36}'));
    expect(codes(r)).toContain('ci-p-disagree');
  });
});
