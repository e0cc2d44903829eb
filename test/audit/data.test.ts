/**
 * With --data: the pairing account (ids, incomplete pairs, repeats) and the recomputation of the
 * colleague's procedure against the reported numbers. Reference numbers: scipy on the same
 * invented data (test/fixtures/scipy-audit/cases.py writes both the CSV files and cases.json).
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { auditRecord } from '../../src/audit/index.js';
import { auditOnData } from '../../src/audit/on-data.js';
import { accountPairing } from '../../src/audit/pairing.js';
import { readTableFromText } from '../../src/data/read.js';
import { columnRequests } from '../../src/data/prepare.js';
import type { LayoutSpec } from '../../src/data/types.js';
import { parse, rec } from './helpers.js';

const dataDir = fileURLToPath(new URL('../../cases/audit/data/', import.meta.url));
const cases = JSON.parse(readFileSync(fileURLToPath(new URL('../fixtures/scipy-audit/cases.json', import.meta.url)), 'utf8')).cases;
const tmp = mkdtempSync(join(tmpdir(), 'tandem-audit-data-'));

function account(csv: string, m: LayoutSpec) {
  const outcome = { binary: false };
  return accountPairing(readTableFromText(csv, 'mem.csv', columnRequests(m, outcome)), m, outcome);
}

function auditWith(yaml: string, file: string) {
  const p = parse(yaml);
  if (p.problems.length) throw new Error(p.problems.map((x) => x.message).join('\n'));
  return auditRecord(p.record, null, { onData: (ctx, out) => auditOnData(file, file, ctx, out).comparison });
}

const codes = (r: { findings: { code: string }[] }): string[] => r.findings.map((f) => f.code);

describe('pairing account', () => {
  it('long layout: repeats within a condition, unmatched ids, complete pairs', () => {
    const csv = 'id,cond,v\nA1,x,1\nA1,x,2\nA1,y,3\nA2,x,4\nA3,x,5\nA3,y,6\n';
    const acc = account(csv, { layout: 'long', id: 'id', condition: 'cond', value: 'v', firstLevel: 'x', secondLevel: 'y' });
    expect(acc.duplicates).toEqual([{ id: 'A1 (x)', times: 2, lines: [2, 3] }]);
    expect(acc.unmatched).toEqual(['A2']);
    expect(acc.pairs).toBe(2);
    expect(acc.incomplete).toBe(1);
  });
  it('wide layout with ids: incomplete rows and repeated ids with their lines', () => {
    const csv = 'id,a,b\nP1,1,2\nP2,3,\nP1,5,6\nP3,,8\nP4,9,10\n';
    const acc = account(csv, { layout: 'wide', id: 'id', first: 'a', second: 'b', pairBy: 'id' });
    expect(acc.duplicates).toEqual([{ id: 'P1', times: 2, lines: [2, 4] }]);
    expect(acc.incomplete).toBe(2);
    expect(acc.pairs).toBe(3);
    expect([acc.firstValues.length, acc.secondValues.length]).toEqual([4, 4]);
  });
  it('two separate columns say there is no link', () => {
    const acc = account('a,b\n1,2\n3,\n', { layout: 'columns', first: 'a', second: 'b' });
    expect(acc.lines.join(' ')).toMatch(/no link/);
    expect(acc.pairs).toBeUndefined();
  });
});

describe('recomputation on the data', () => {
  it('the colleague\'s paired t on row-order pairs reproduces the report (rut depth, scipy: t = -1.84188)', () => {
    const r = auditWith(rec('procedure: paired-t\npairing: row-order\nn: 9\ndf: 8\nstatistic: -1.84\npValue: 0.103\nestimate: -1.10', 'study:\n  design: {family: independent}\ndata:\n  mapping: {layout: columns, first: new_mix_mm, second: old_mix_mm}\n'), join(dataDir, 'rut-depth.csv'));
    expect(codes(r)).not.toContain('data-reported-differs');
    expect(r.data!.colleague.result!.statistic).toBeCloseTo(cases['road-row-order'].paired_rows.t, 10);
    expect(r.data!.recommended!.result!.procedure).toBe('welch-t');
    expect(r.data!.recommended!.result!.statistic).toBeCloseTo(cases['road-row-order'].welch.t, 10);
  });
  it('numbers the data do not give are reported with the recomputed values', () => {
    const r = auditWith(rec('procedure: paired-t\nn: 9\ndf: 8\nstatistic: -2.84\npValue: 0.103\nestimate: -1.10', 'study:\n  design: {family: paired}\ndata:\n  mapping: {layout: wide, first: new_mix_mm, second: old_mix_mm, pairBy: row-order}\n'), join(dataDir, 'rut-depth.csv'));
    const f = r.findings.find((x) => x.code === 'data-reported-differs')!;
    expect(f.message).toMatch(/statistic -2\.84 \(data: -1\.8419\)/);
  });
  it('incomplete pairs kept in the count, and unmatched ids named (sap flow, long layout)', () => {
    const r = auditWith(rec('procedure: paired-t\nn: 13\nstatistic: -1.43\nestimate: -1.33', 'study:\n  design: {family: paired}\ndata:\n  mapping: {layout: long, id: tree, condition: stage, value: litres_per_day, firstLevel: after, secondLevel: before}\n'), join(dataDir, 'sap-flow.csv'));
    expect(codes(r)).toEqual(expect.arrayContaining(['data-incomplete-kept', 'data-unmatched-ids']));
    expect(r.findings.find((x) => x.code === 'data-unmatched-ids')!.message).toMatch(/T05, T09, T12/);
    expect(r.data!.colleague.result!.n.pairs).toBe(11);
    expect(r.data!.colleague.result!.statistic).toBeCloseTo(cases['orchard-incomplete'].paired_complete.t, 10);
  });
  it('repeated ids are a finding, not a crash; the procedures that need clean pairs say why they did not run', () => {
    const r = auditWith(rec('procedure: paired-t\nn: 11', 'study:\n  design: {family: paired}\ndata:\n  mapping: {layout: wide, id: wheel, first: week8_N, second: week4_N, pairBy: id}\n'), join(dataDir, 'wheel-firmness.csv'));
    expect(codes(r)).toContain('data-duplicate-ids');
    expect(r.findings.find((x) => x.code === 'data-duplicate-ids')!.message).toMatch(/W4 \(2 times, lines 5, 12\)/);
    expect(r.data!.colleague.result).toBeNull();
    expect(r.data!.colleague.why).toMatch(/pairing account/);
  });
  it('a plain paired t on crossover data takes each subject\'s values by condition', () => {
    // Invented: 6 operators; sequence AB had script A in week 1. First condition = A.
    const csv = 'op,seq,w1,w2\n1,AB,6.1,5.8\n2,AB,6.5,6.0\n3,AB,7.0,6.9\n4,BA,5.9,6.4\n5,BA,6.2,6.8\n6,BA,5.5,5.6\n';
    const file = join(tmp, 'cross.csv');
    writeFileSync(file, csv);
    const r = auditWith(rec('procedure: paired-t', 'study:\n  design: {family: paired, kind: crossover}\ndata:\n  mapping: {layout: crossover, id: op, sequence: seq, firstThenSecond: AB, secondThenFirst: BA, period1: w1, period2: w2}\n'), file);
    // A values: 6.1, 6.5, 7.0, 6.4, 6.8, 5.6; B values: 5.8, 6.0, 6.9, 5.9, 6.2, 5.5 -> mean difference 0.35
    expect(r.data!.colleague.result!.estimate).toBeCloseTo(0.35, 12);
    expect(codes(r)).toContain('crossover-plain-paired');
  });
});
