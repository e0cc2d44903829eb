/** Reading audit records: schema errors with positions, digits kept as written, bad numbers refused. */
import { describe, expect, it } from 'vitest';
import { FINDING_CODES, isFindingCode } from '../../src/audit/codes.js';
import { parse, rec } from './helpers.js';

describe('audit record format', () => {
  it('keeps the reported digits from the YAML source, not the parsed number', () => {
    const p = parse(rec('pValue: 0.0430\nstatistic: 2.10\nn: 24'));
    expect(p.problems).toEqual([]);
    expect(p.record.reported.pValue!.text).toBe('0.0430');
    expect(p.record.reported.pValue!.halfUnit).toBeCloseTo(0.00005, 15);
    expect(p.record.reported.statistic!.text).toBe('2.10');
    expect(p.record.reported.n!.halfUnit).toBe(0);
    expect(p.record.reported.pValue!.line).toBe(4);
  });
  it('reads quoted bounds and percentages', () => {
    const p = parse(rec('pValue: "< 0.001"\nci: {lower: 1.2, upper: 3.4, level: "90%"}'));
    expect(p.record.reported.pValue!.bound).toBe('<');
    expect(p.record.reported.confidence).toBeCloseTo(0.9, 12);
  });
  it('an interval without a level is taken at 95%', () => {
    expect(parse(rec('ci: {lower: 1.2, upper: 3.4}')).record.reported.confidence).toBe(0.95);
  });
  it('unknown keys, wrong enums and a missing title are reported at their line and column', () => {
    const p = parse('format: tandem-audit/1\nreported:\n  alternative: bigger\n  pvalue: 0.04\n');
    const msgs = p.problems.map((x) => `${x.line}:${x.col} ${x.code} ${x.message}`);
    expect(msgs).toEqual(expect.arrayContaining([
      expect.stringMatching(/^1:1 missing-key .*title/),
      expect.stringMatching(/^3:16 unknown-value reported.alternative/),
      expect.stringMatching(/^4:3 unknown-key unknown key 'pvalue'/),
    ]));
  });
  it('the format line must name tandem-audit/1', () => {
    const p = parse('format: tandem-audit/2\ntitle: x\nreported: {}\n');
    expect(p.problems[0].message).toMatch(/format/);
  });
  it('a number written with a decimal comma or as a word is refused at its position', () => {
    const p = parse(rec('pValue: "0,043"\nestimate: about two'));
    const msgs = p.problems.map((x) => `${x.line}:${x.col} ${x.message}`);
    expect(msgs[0]).toMatch(/^4:11 reported\.pValue: .*decimal point/);
    expect(msgs[1]).toMatch(/^5:13 reported\.estimate: 'about two' is not a number/);
  });
  it('only p-values may be bounds; counts must be whole numbers', () => {
    const p = parse(rec('estimate: "< 2"\nn: 12.5'));
    expect(p.problems.map((x) => x.message).join('\n')).toMatch(/estimate must be a number as written, not a bound[\s\S]*n must be a whole number/);
  });
  it('study facts: one source only', () => {
    const p = parse('format: tandem-audit/1\ntitle: x\nstudy:\n  answers: {unit: hive}\n  planFile: plan.yaml\nreported: {}\n');
    expect(p.problems[0]).toMatchObject({ line: 5, message: expect.stringMatching(/both answers and planFile/) });
  });
  it('keys that could reach an object prototype are refused', () => {
    expect(parse(rec('__proto__: {x: 1}')).problems[0].message).toMatch(/not allowed/);
  });
  it('a data mapping is validated by layout', () => {
    const p = parse(rec('n: 3', 'data:\n  mapping: {layout: wide, first: a}\n'));
    expect(p.problems.map((x) => x.message).join('\n')).toMatch(/second/);
    expect(p.problems.map((x) => x.message).join('\n')).not.toMatch(/then/);
  });
  it('the expect block of a case is read and does not take part in the audit', () => {
    const p = parse(rec('n: 3', 'expect: {codes: [df-inconsistent], exit: 1}\n'));
    expect(p.expect).toEqual({ codes: ['df-inconsistent'], exit: 1 });
  });
});

describe('finding codes', () => {
  it('form a closed, documented set of kebab-case codes with a severity each', () => {
    for (const [code, def] of Object.entries(FINDING_CODES)) {
      expect(code).toMatch(/^[a-z0-9]+(-[a-z0-9]+)+$/);
      expect(['error', 'warning', 'note']).toContain(def.severity);
      expect(def.doc.length).toBeGreaterThan(20);
    }
    expect(isFindingCode('p-inconsistent')).toBe(true);
    expect(isFindingCode('p-wrong')).toBe(false);
  });
});
