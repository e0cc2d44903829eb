/** Design against procedure: each finding from the study facts (a Recommendation as the engine returns it). */
import { describe, expect, it } from 'vitest';
import { audit, codes, rec, recommendation } from './helpers.js';

const paired = recommendation('paired', 'repeated-measures', 'paired-t');
const independent = recommendation('independent', 'randomized-groups', 'welch-t');

describe('design and procedure', () => {
  it('an independent-groups test on paired data is an error, with the paired procedure as the fix', () => {
    const r = audit(rec('procedure: welch-t\ndifference: {first: new rack, second: old rack}'), paired);
    const f = r.findings.find((x) => x.code === 'independent-test-on-paired')!;
    expect(f.severity).toBe('error');
    expect(f.fix).toMatch(/paired t on the differences.*new rack minus old rack.*pairs - 1/);
  });
  it('names the unit in the plural by the usual English endings (loaf -> loaves, colony -> colonies, batch -> batches)', () => {
    const message = (unit: string): string =>
      audit(rec('procedure: welch-t', `study:\n  answers:\n    unit: ${unit}\n`), paired).findings.find((x) => x.code === 'independent-test-on-paired')!.message;
    expect(message('loaf')).toContain('instead of loaves');
    expect(message('colony')).toContain('instead of colonies');
    expect(message('dye batch')).toContain('instead of dye batches');
    expect(message('test weld')).toContain('instead of test welds');
  });
  it('a paired test on independent groups is an error', () => {
    expect(codes(audit(rec('procedure: paired t-test'), independent))).toContain('paired-test-on-unmatched');
  });
  it('the right family raises no design finding', () => {
    const found = codes(audit(rec('procedure: paired-t\ndifference: {first: a, second: b}'), paired));
    expect(found.filter((c) => c.includes('test-on'))).toEqual([]);
  });
  it('pairing by row order is an error, worded for a design with no link', () => {
    const r = audit(rec('procedure: paired-t\npairing: row-order'), recommendation('other', 'arbitrary-pairing', null));
    const f = r.findings.find((x) => x.code === 'row-order-pairing')!;
    expect(f.message).toMatch(/invented/);
    expect(f.fix).toMatch(/independent groups/);
  });
  it('pairing by row order where an id exists: join by the id', () => {
    const f = audit(rec('procedure: paired-t\npairing: row-order'), paired).findings.find((x) => x.code === 'row-order-pairing')!;
    expect(f.fix).toMatch(/identifier/);
  });
  it('matching after the outcomes is a warning', () => {
    const r = audit(rec('procedure: paired-t'), recommendation('paired', 'matched-after', 'paired-t'));
    expect(r.findings.find((x) => x.code === 'matched-after')?.severity).toBe('warning');
  });
  it('a plain paired t on a crossover with periods recorded is a warning; the crossover analysis is not flagged', () => {
    const cross = recommendation('paired', 'crossover', 'crossover-t');
    expect(codes(audit(rec('procedure: paired-t'), cross))).toContain('crossover-plain-paired');
    expect(codes(audit(rec('procedure: crossover-t'), cross))).not.toContain('crossover-plain-paired');
    expect(codes(audit(rec('procedure: paired-t\nperiodUsed: true'), cross))).not.toContain('crossover-plain-paired');
  });
  it('several pairwise tests with more than two time points: error, with the false-alarm rate', () => {
    const r = audit(rec('procedure: paired-t\ncomparisons: 3'), paired);
    const f = r.findings.find((x) => x.code === 'multiple-pairwise-timepoints')!;
    expect(f.severity).toBe('error');
    expect(f.message).toMatch(/0\.14/); // 1 - 0.95^3 = 0.142625
    expect(codes(audit(rec('procedure: paired-t'), recommendation('other', 'more-than-two', null)))).toContain('multiple-pairwise-timepoints');
  });
  it('pseudo-replication from a clustered design or from repeated readings entered as units', () => {
    expect(codes(audit(rec('procedure: welch-t'), recommendation('other', 'clustered', null)))).toContain('pseudo-replication');
    expect(codes(audit(rec('procedure: welch-t\nrepeatedPerUnit: true'), independent))).toContain('pseudo-replication');
  });
  it('a design outside a two-sample comparison says what to do instead', () => {
    const noLink = recommendation('other', 'no-link', null);
    noLink.design.instead = 'Recover the link between the two records, or analyse as independent groups.';
    const f = audit(rec('procedure: paired-t'), noLink).findings.find((x) => x.code === 'design-outside-two-sample')!;
    expect(f.fix).toMatch(/Recover the link/);
  });
  it('a t procedure on a yes/no outcome, and a proportion procedure on a measured one', () => {
    expect(codes(audit(rec('procedure: welch-t'), recommendation('independent', 'randomized-groups', 'two-proportions')))).toContain('outcome-type-mismatch');
    expect(codes(audit(rec('procedure: mcnemar'), paired))).toContain('outcome-type-mismatch');
  });
  it('the pooled t where Welch is recommended is a note', () => {
    const r = audit(rec('procedure: pooled-t'), independent);
    expect(r.findings.find((x) => x.code === 'procedure-not-recommended')?.severity).toBe('note');
  });
  it('an unknown procedure name and missing study facts are notes', () => {
    expect(codes(audit(rec('procedure: the usual test')))).toEqual(expect.arrayContaining(['procedure-unknown', 'design-unknown']));
  });
  it('a design stated by the reviewer serves when there are no answers', () => {
    const r = audit(rec('procedure: welch-t', 'study:\n  design: {family: paired, kind: split-units}\n'));
    expect(codes(r)).toContain('independent-test-on-paired');
    expect(codes(r)).not.toContain('design-unknown');
  });
});

describe('procedure chosen after a pre-test', () => {
  it('an equal-spread pre-test points to Welch by default', () => {
    const f = audit(rec('procedure: pooled-t\npretest: equal-spread'), independent).findings.find((x) => x.code === 'pretest-selection')!;
    expect(f.severity).toBe('warning');
    expect(f.fix).toMatch(/Welch/);
  });
  it('a normality pre-test points to a pre-declared sensitivity analysis', () => {
    const f = audit(rec('procedure: signed-rank\npretest: normality'), paired).findings.find((x) => x.code === 'pretest-selection')!;
    expect(f.fix).toMatch(/sensitivity/);
  });
  it('no pre-test, no finding', () => {
    expect(codes(audit(rec('procedure: paired-t\npretest: none'), paired))).not.toContain('pretest-selection');
  });
});
