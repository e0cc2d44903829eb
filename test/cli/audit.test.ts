/** `tandem audit` through run(argv, io) with in-memory IO: options, exit codes, output forms, files. */
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { beforeAll, describe, expect, it } from 'vitest';
import { run } from '../../src/cli/run.js';
import { memoryIO } from '../helpers/io.js';

const dataDir = fileURLToPath(new URL('../../cases/audit/data/', import.meta.url));
let dir: string;

// Invented: a bakery's before/after loaf measurements analysed with Welch (a flawed record), and a
// sound paired report of the same loaves. The design is stated directly, so these tests do not
// depend on the rule base's answers.
const flawed = `# yaml-language-server: $schema=../schemas/audit-v1.schema.json
format: tandem-audit/1
title: Crust moisture before and after the new cooling rack
study:
  design: {family: paired, kind: repeated-measures}
reported:
  procedure: Welch two-sample t-test
  difference: {first: after new rack, second: before new rack}
  alternative: two-sided
  n1: 10
  n2: 10
  df: 17.9
  statistic: -0.957
  pValue: 0.351
  estimate: -0.737
  ci: {lower: -2.36, upper: 0.881}
data:
  mapping: {layout: wide, id: loaf, first: after_rack, second: before_rack, pairBy: id}
`;
// paired t on the same ten loaves: t = -5.54031, p = 0.000360905, interval -1.03792 to -0.436076
// (scipy, test/fixtures/scipy-audit/cases.json, "bakery-welch-on-paired").
const sound = `format: tandem-audit/1
title: Crust moisture before and after the new cooling rack
study:
  design: {family: paired, kind: repeated-measures}
reported:
  procedure: paired-t
  difference: {first: after new rack, second: before new rack}
  alternative: two-sided
  n: 10
  df: 9
  statistic: -5.54
  pValue: 0.00036
  estimate: -0.737
  ci: {lower: -1.038, upper: -0.436}
data:
  mapping: {layout: wide, id: loaf, first: after_rack, second: before_rack, pairBy: id}
`;

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'tandem-audit-'));
  writeFileSync(join(dir, 'flawed.yaml'), flawed);
  writeFileSync(join(dir, 'sound.yaml'), sound);
  writeFileSync(join(dir, 'broken.yaml'), 'format: tandem-audit/1\ntitle: x\nreported:\n  alternative: upward\n  pValue: "0,04"\n');
  writeFileSync(join(dir, 'nomap.yaml'), sound.replace(/data:\n.*\n$/s, ''));
});

async function audit(args: string[], color = false) {
  const io = memoryIO({ cwd: dir, color });
  const code = await run(['audit', ...args], io);
  return { code, out: io.out(), err: io.err() };
}

describe('tandem audit', () => {
  it('--help describes the command and its exit codes', async () => {
    const r = await audit(['--help']);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/--data FILE[\s\S]*--report FILE\.md[\s\S]*Exit codes: 0/);
  });
  it('a flawed record exits 1 and prints the findings with what to do', async () => {
    const r = await audit(['flawed.yaml']);
    expect(r.code).toBe(1);
    expect(r.err).toBe('');
    expect(r.out).toMatch(/^Review of the reported analysis: Crust moisture/);
    for (const s of ['Verdict', 'The study as described', 'What was reported', 'Findings', 'Numbers rechecked', 'Limits of this review']) expect(r.out).toContain(s);
    expect(r.out).toMatch(/ERROR independent-test-on-paired\n.*\n    What to do: /);
    expect(r.out).not.toMatch(/\u001b\[/);
  });
  it('a sound record exits 0', async () => {
    const r = await audit(['sound.yaml']);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/0 errors/);
  });
  it('--json gives findings with code, severity, message and fix', async () => {
    const r = await audit(['flawed.yaml', '--json']);
    expect(r.code).toBe(1);
    const j = JSON.parse(r.out);
    expect(j.summary).toMatchObject({ errors: 1, exit: 1 });
    expect(j.findings[0]).toEqual(expect.objectContaining({ code: 'independent-test-on-paired', severity: 'error', message: expect.any(String), fix: expect.any(String) }));
    expect(j.checks.length).toBeGreaterThan(0);
  });
  it('--data puts the colleague\'s procedure and the recommended one side by side', async () => {
    const r = await audit(['flawed.yaml', '--data', join(dataDir, 'loaf-moisture.csv')]);
    expect(r.out).toContain('Side by side on the data');
    expect(r.out).toMatch(/as the colleague ran it: Welch two-sample t\s+as recommended: paired t on the differences/);
    expect(r.out).toMatch(/t = -5\.54/); // scipy: -5.54031
    const j = JSON.parse((await audit(['flawed.yaml', '--json', '--data', join(dataDir, 'loaf-moisture.csv')])).out);
    expect(j.data.recommended.result.pValue).toBeCloseTo(0.000360905, 8);
    expect(j.findings.map((f: { code: string }) => f.code)).toContain('data-conclusion-changes');
  });
  it('--report writes a Markdown review, refuses to overwrite without --force (exit 3), replaces with it', async () => {
    const md = join(dir, 'review.md');
    const r = await audit(['flawed.yaml', '--report', 'review.md']);
    expect(r.code).toBe(1);
    expect(r.out).toContain('Review written to review.md');
    const text = readFileSync(md, 'utf8');
    expect(text).toMatch(/^# Review of the reported analysis: Crust moisture/);
    expect(text).toMatch(/## Findings\n\n### 1\. error: /);
    expect(text).toMatch(/\*\*What to do:\*\*/);
    expect(text).toMatch(/\| what \| reported \| consistent values \| verdict \|/);
    const again = await audit(['sound.yaml', '--report', 'review.md']);
    expect(again.code).toBe(3);
    expect(again.err).toMatch(/exists.*--force/);
    expect(readFileSync(md, 'utf8')).toBe(text);
    const forced = await audit(['sound.yaml', '--report', 'review.md', '--force']);
    expect(forced.code).toBe(0);
    expect(readFileSync(md, 'utf8')).not.toBe(text);
  });
  it('colour only when the IO allows it', async () => {
    expect((await audit(['flawed.yaml'], true)).out).toMatch(/\u001b\[/);
  });
});

describe('tandem audit: bad input exits 2 and writes nothing', () => {
  it('no record', async () => {
    const r = await audit([]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/one audit record file; got none/);
  });
  it('a missing file', async () => {
    const r = await audit(['nowhere.yaml']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/cannot read audit record nowhere\.yaml: no such file/);
  });
  it('an invalid record lists every problem with line and column', async () => {
    const r = await audit(['broken.yaml', '--report', 'broken.md']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/broken\.yaml is not a valid audit record/);
    expect(r.err).toMatch(/broken\.yaml:4:16: reported\.alternative must be equal to one of the allowed values/);
    expect(existsSync(join(dir, 'broken.md'))).toBe(false);
  });
  it('a bad number as written', async () => {
    writeFileSync(join(dir, 'comma.yaml'), 'format: tandem-audit/1\ntitle: x\nreported:\n  pValue: "0,04"\n');
    const r = await audit(['comma.yaml']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/comma\.yaml:4:11: reported\.pValue: '0,04' is not a number as written \(write a decimal point/);
  });
  it('--data without a mapping says how to give one', async () => {
    const r = await audit(['nomap.yaml', '--data', join(dataDir, 'loaf-moisture.csv')]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/data\.mapping/);
  });
  it('an unknown option', async () => {
    const r = await audit(['sound.yaml', '--pdf']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/--pdf/);
  });
  it('a data file that does not exist', async () => {
    const r = await audit(['sound.yaml', '--data', 'missing.csv']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/missing\.csv/);
  });
});
