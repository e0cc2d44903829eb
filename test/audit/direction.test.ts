/** Direction of subtraction, sidedness and the study's expected direction. */
import { describe, expect, it } from 'vitest';
import { audit, codes, rec, recommendation } from './helpers.js';

describe('direction and sidedness', () => {
  it('a one-sided test with no stated subtraction is an error', () => {
    expect(codes(audit(rec('procedure: paired-t\nalternative: greater\nstatistic: 1.6\ndf: 14\npValue: 0.066')))).toContain('one-sided-no-direction');
  });
  it('no subtraction stated with a two-sided test is a note', () => {
    const r = audit(rec('procedure: paired-t\nestimate: 1.2'));
    expect(r.findings.find((f) => f.code === 'direction-unstated')?.severity).toBe('note');
  });
  it('"greater" with a negative t and a small p: the p belongs to the other direction', () => {
    // ferry case: t = -5.67043 on 9 df; P(T < t) = 0.000153 (scipy)
    const r = audit(rec('procedure: paired-t\ndifference: {first: new berth routine, second: old routine}\nalternative: greater\nn: 10\ndf: 9\nstatistic: -5.67\npValue: 0.00015'));
    const f = r.findings.find((x) => x.code === 'sign-vs-direction')!;
    expect(f.severity).toBe('error');
    expect(f.message).toMatch(/above 0\.5/);
    expect(codes(r)).not.toContain('p-inconsistent');
  });
  it('"greater" with a negative t and its correct p above 0.5 is reported as data against the alternative', () => {
    const r = audit(rec('procedure: paired-t\ndifference: {first: new, second: old}\nalternative: greater\ndf: 9\nstatistic: -5.67\npValue: 0.99985'));
    expect(r.findings.find((x) => x.code === 'sign-vs-direction')!.message).toMatch(/lean against/);
    expect(codes(r)).not.toContain('p-inconsistent');
  });
  it('a conclusion that reads the sign backwards', () => {
    expect(codes(audit(rec('procedure: paired-t\ndifference: {first: new, second: old}\nestimate: -1.45\nclaim: first-higher')))).toContain('sign-vs-direction');
  });
  it('a one-sided test the study did not plan', () => {
    const r = audit(rec('procedure: paired-t\ndifference: {first: a, second: b}\nalternative: greater'), recommendation('paired', 'natural-pairs', 'paired-t'));
    expect(codes(r)).toContain('one-sided-not-planned');
  });
  it('the alternative against the planned direction, allowing for a reversed subtraction', () => {
    const planned = recommendation('paired', 'natural-pairs', 'paired-t', { alternative: 'greater' });
    planned.answers = {};
    const answers = 'study:\n  answers: {first_label: mulch A, second_label: mulch B}\n';
    // planned: mulch A higher, i.e. A minus B > 0
    expect(codes(audit(rec('procedure: paired-t\ndifference: {first: mulch A, second: mulch B}\nalternative: less', answers), planned))).toContain('alternative-vs-plan');
    expect(codes(audit(rec('procedure: paired-t\ndifference: {first: mulch B, second: mulch A}\nalternative: less', answers), planned))).not.toContain('alternative-vs-plan');
    expect(codes(audit(rec('procedure: paired-t\ndifference: {first: mulch A, second: mulch B}\nalternative: greater', answers), planned))).not.toContain('alternative-vs-plan');
  });
});
