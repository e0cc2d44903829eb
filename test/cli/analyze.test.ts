/**
 * `tandem analyze` end to end through run(argv, io): the wiring (which columns, which direction,
 * what was dropped, which JSON fields, which exit code), not the numbers of the procedures, which
 * their own tests check against published examples and reference libraries. Where a number is
 * checked here it is recomputed in the test from the fixture (e.g. the mean of the differences).
 * All data are invented (test/fixtures/data).
 */
import { describe, expect, it } from 'vitest';
import { existsSync, mkdtempSync, readFileSync, writeFileSync, copyFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { run } from '../../src/cli/run.js';
import { memoryIO } from '../helpers/io.js';

const FIX = join(import.meta.dirname, '../fixtures/data');
const tmp = mkdtempSync(join(tmpdir(), 'tandem-analyze-'));

async function analyze(args: string[], opts: { cwd?: string; color?: boolean } = {}) {
  const io = memoryIO({ cwd: opts.cwd ?? FIX, color: opts.color });
  const code = await run(['analyze', ...args], io);
  return { code, out: io.out(), err: io.err() };
}

async function json(args: string[], cwd?: string) {
  const r = await analyze([...args, '--json'], { cwd });
  return { ...r, doc: r.out ? (JSON.parse(r.out) as Record<string, any>) : null };
}

function csv(name: string, text: string): string {
  const path = join(tmp, name);
  writeFileSync(path, text);
  return path;
}

/** The kiln fixture's differences, gauge A minus gauge B, computed here from the file. */
function kilnDiffs(): number[] {
  const rows = readFileSync(join(FIX, 'kiln-tiles-wide.csv'), 'utf8').trim().split('\n').slice(1);
  return rows.map((r) => r.split(',')).map(([, a, b]) => Number(a) - Number(b));
}
const mean = (xs: number[]): number => xs.reduce((s, x) => s + x, 0) / xs.length;

const WIDE = ['--data', 'kiln-tiles-wide.csv', '--procedure', 'paired-t', '--first', 'gauge_a_um', '--second', 'gauge_b_um', '--id', 'tile'];

describe('tandem analyze, quick mode', () => {
  it('runs the paired t and the named sensitivity analysis, with the fields the JSON promises', async () => {
    const { code, doc, err } = await json([...WIDE, '--sensitivity', 'signed-rank', '--unit', 'um']);
    expect(err).toBe('');
    expect(code).toBe(0);
    expect(doc).toMatchObject({ format: 'tandem-analysis/1', procedure: 'paired-t', confidence: 0.95, alternative: 'two-sided', df: 11 });
    expect(doc!.n).toEqual({ pairs: 12, dropped: 0 });
    expect(doc!.estimate).toBeCloseTo(mean(kilnDiffs()), 10);
    expect(doc!.ci).toHaveLength(2);
    expect(doc!.ci[0]).toBeLessThan(doc!.estimate);
    for (const k of ['statistic', 'pValue']) expect(typeof doc![k]).toBe('number');
    expect(doc!.effectSize).toMatchObject({ name: 'd_z' });
    expect(doc!.effectSize.ci).toHaveLength(2);
    expect(doc!.diagnostics).toHaveLength(1);
    expect(doc!.diagnostics[0]).toMatchObject({ label: 'differences (gauge_a_um minus gauge_b_um)', n: 12 });
    expect(doc!.difference).toMatch(/gauge_a_um minus gauge_b_um/);
    expect(doc!.conclusion).toMatch(/gauge_a_um minus gauge_b_um/);
    expect(doc!.conclusion).toMatch(/um/);
    expect(doc!.sensitivity).toMatchObject({ procedure: 'signed-rank', available: true, alternative: 'two-sided' });
    for (const k of ['n', 'estimate', 'ci', 'confidence', 'statistic', 'pValue', 'effectSize']) expect(doc!.sensitivity).toHaveProperty(k);
  });

  it('swapping first and second flips the sign of the estimate and of the interval', async () => {
    const a = (await json(WIDE)).doc!;
    const b = (await json(['--data', 'kiln-tiles-wide.csv', '--procedure', 'paired-t', '--first', 'gauge_b_um', '--second', 'gauge_a_um', '--id', 'tile'])).doc!;
    expect(b.estimate).toBeCloseTo(-a.estimate, 12);
    expect(b.ci[0]).toBeCloseTo(-a.ci[1], 12);
    expect(b.difference).toMatch(/gauge_b_um minus gauge_a_um/);
  });

  it('joins the long layout by id and gets the same pairs as the wide file', async () => {
    const wide = (await json(WIDE)).doc!;
    const long = (await json(['--data', 'kiln-tiles-long.csv', '--procedure', 'paired-t', '--id', 'tile', '--condition', 'gauge', '--value', 'thickness_um', '--first-level', 'gauge A', '--second-level', 'gauge B'])).doc!;
    expect(long.n).toEqual({ pairs: 12, dropped: 0 });
    expect(long.estimate).toBeCloseTo(wide.estimate, 12);
    expect(long.pValue).toBeCloseTo(wide.pValue, 12);
    expect(long.labels).toEqual({ first: 'gauge A', second: 'gauge B' });
  });

  it('writes the open end of a one-sided interval as null, with a note', async () => {
    const { doc } = await json([...WIDE, '--alternative', 'greater']);
    expect(doc!.alternative).toBe('greater');
    expect(doc!.ci[1]).toBeNull();
    expect(typeof doc!.ci[0]).toBe('number');
    expect(doc!.ciNote).toMatch(/infinite end/);
  });

  it('analyses independent groups, counting the dropped missing value and naming the default levels', async () => {
    const { code, doc } = await json(['--data', 'hive-feed-groups.csv', '--procedure', 'welch-t', '--group', 'feed', '--value', 'gain_kg', '--sensitivity', 'rank-sum']);
    expect(code).toBe(0);
    expect(doc!.n).toEqual({ first: 6, second: 6, dropped: 1 });
    expect(doc!.labels).toEqual({ first: 'syrup', second: 'fondant' });
    expect(doc!.data.notes.join(' ')).toMatch(/taking 'syrup' as first and 'fondant' as second/);
    expect(doc!.diagnostics.map((d: { label: string }) => d.label)).toEqual(['syrup', 'fondant']);
    expect(doc!.sensitivity.procedure).toBe('rank-sum');
  });

  it('reads each group from its own column of a different length', async () => {
    const { code, doc } = await json(['--data', 'hive-feed-columns.csv', '--procedure', 'welch-t', '--first', 'syrup_kg', '--second', 'fondant_kg']);
    expect(code).toBe(0);
    expect(doc!.n).toMatchObject({ first: 7, second: 6 });
  });

  it('analyses a 2x2 crossover given the sequence that took the first condition first', async () => {
    const { code, doc } = await json(['--data', 'ferry-ramp-crossover.csv', '--procedure', 'crossover-t', '--sequence', 'sequence', '--period1', 'week1_min', '--period2', 'week2_min', '--first-then-second', 'new-first', '--id', 'crew', '--sensitivity', 'rank-sum']);
    expect(code).toBe(0);
    expect(doc!.procedure).toBe('crossover-t');
    expect(doc!.diagnostics).toHaveLength(2);
    expect(doc!.sensitivity).toMatchObject({ procedure: 'rank-sum', available: true });
    expect(doc!.diagnostics[0].label).toMatch(/half period differences, sequence new-first/);
    expect(doc!.difference).toMatch(/the condition given first in sequence 'new-first' minus/);
    // The rank-based check reads the half period differences, so its shift has the same sign.
    expect(Math.sign(doc!.sensitivity.estimate)).toBe(Math.sign(doc!.estimate));
  });

  it('maps a yes/no outcome to 0/1 for McNemar and skips shape diagnostics', async () => {
    const { code, doc } = await json(['--data', 'dye-fixative-binary.csv', '--procedure', 'mcnemar', '--first', 'fixative_p_pass', '--second', 'fixative_q_pass', '--id', 'swatch']);
    expect(code).toBe(0);
    expect(doc!.outcome.binary).toBe(true);
    expect(doc!.diagnostics).toEqual([]);
    expect(doc!.diagnosticsNote).toMatch(/0\/1 outcome/);
  });

  it('reads a quoted, semicolon-separated file with a BOM through the full parser', async () => {
    const { code, doc } = await json(['--data', 'orchard-quoted.csv', '--procedure', 'welch-t', '--group', 'variety', '--value', 'yield, kg', '--first-level', 'Gala', '--second-level', 'Cox']);
    expect(code).toBe(0);
    expect(doc!.data).toMatchObject({ parser: 'full', delimiter: 'semicolon', rows: 7 });
    expect(doc!.n).toEqual({ first: 3, second: 3, dropped: 1 });
    expect(doc!.difference).toMatch(/Gala minus Cox/);
  });

  it('passes --missing and --delimiter to the reader', async () => {
    const path = csv('dots.csv', 'a\tb\n1.5\t1.1\n.\t2.0\n2.5\t2.2\n3.0\t2.1\n');
    const r = await json(['--data', path, '--procedure', 'paired-t', '--first', 'a', '--second', 'b', '--pair-by-row-order', '--missing', '.', '--delimiter', 'tab']);
    expect(r.code).toBe(0);
    expect(r.doc!.n).toEqual({ pairs: 3, dropped: 1 });
    expect(r.doc!.data.missingMarkers).toEqual(['', '.']);
    const wrong = await analyze(['--data', path, '--procedure', 'paired-t', '--first', 'a', '--second', 'b', '--pair-by-row-order']);
    expect(wrong.code).toBe(2);
    expect(wrong.err).toMatch(/'\.' is not a number/);
  });

  it('prints the text report with our own sections, a plot, and no colour when colour is off', async () => {
    const { code, out } = await analyze([...WIDE, '--sensitivity', 'signed-rank']);
    expect(code).toBe(0);
    for (const s of ['What was compared', 'Result: paired t', 'Sensitivity analysis', 'Checks on the data', 'Data handling', 'Conclusion']) expect(out).toContain(s);
    expect(out).not.toMatch(/\bState\b|\bPlan\b:|\bDo\b|Conclude/);
    expect(out).toMatch(/\[=+o=+\]/);
    expect(out).not.toMatch(/\u001b\[/);
    const coloured = await analyze(WIDE, { color: true });
    expect(coloured.out).toMatch(/\u001b\[/);
  });

  it('writes the Markdown report atomically and refuses to overwrite without --force', async () => {
    const dir = mkdtempSync(join(tmp, 'report-'));
    copyFileSync(join(FIX, 'kiln-tiles-wide.csv'), join(dir, 'kiln.csv'));
    const args = ['--data', 'kiln.csv', '--procedure', 'paired-t', '--first', 'gauge_a_um', '--second', 'gauge_b_um', '--id', 'tile', '--report', 'kiln.md'];
    const first = await analyze(args, { cwd: dir });
    expect(first.code).toBe(0);
    const md = readFileSync(join(dir, 'kiln.md'), 'utf8');
    expect(md).toMatch(/^# /);
    expect(md).toContain('## Conclusion');
    expect(md).toContain('| estimate |');
    const again = await analyze(args, { cwd: dir });
    expect(again.code).toBe(3);
    expect(again.err).toMatch(/exists.*--force/);
    expect((await analyze([...args, '--force'], { cwd: dir })).code).toBe(0);
  });
});

describe('tandem analyze with a plan', () => {
  it('runs the plan\'s procedure and sensitivity, with its labels, scope and warnings', async () => {
    const { code, doc } = await json(['kiln-tiles.plan.yaml', '--data', 'kiln-tiles-wide.csv']);
    expect(code).toBe(0);
    expect(doc).toMatchObject({ mode: 'plan', plan: 'kiln-tiles.plan.yaml', procedure: 'paired-t', labels: { first: 'gauge A', second: 'gauge B' } });
    expect(doc!.sensitivity.procedure).toBe('signed-rank');
    expect(doc!.scope).toMatch(/assigned at random/);
    expect(doc!.conclusion).toMatch(/gauge A minus gauge B/);
    expect(doc!.warnings.length).toBeGreaterThan(0);
    expect(doc!.estimate).toBeCloseTo(mean(kilnDiffs()), 10);
  });

  it("reads an equivalence plan's confidence as the interval level (0.90: each one-sided test at 5%), as the plan schema says", async () => {
    const dir = mkdtempSync(join(tmpdir(), 'tandem-analyze-eq-'));
    copyFileSync(join(FIX, 'kiln-tiles-wide.csv'), join(dir, 'kiln-tiles-wide.csv'));
    const plan = readFileSync(join(FIX, 'kiln-tiles.plan.yaml'), 'utf8').replace(
      /procedure:\n  id: paired-t\n  alternative: two-sided\n  confidence: 0.95\n  nullValue: 0\n/,
      'procedure:\n  id: paired-equivalence\n  alternative: two-sided\n  confidence: 0.9\n  nullValue: 0\n  margin: 50\n',
    );
    expect(plan).toContain('paired-equivalence');
    writeFileSync(join(dir, 'eq.plan.yaml'), plan);
    const { code, doc } = await json(['eq.plan.yaml', '--data', 'kiln-tiles-wide.csv'], dir);
    expect(code).toBe(0);
    expect(doc!.procedure).toBe('paired-equivalence');
    expect(doc!.confidence).toBeCloseTo(0.9, 12);
    expect(doc!.details.alpha).toBeCloseTo(0.05, 12);
    expect(doc!.reading).toMatch(/at the 5% level/);
    // The declared signed-rank is judged by its interval at the same 90% level against the margin.
    expect(doc!.sensitivity.confidence).toBeCloseTo(0.9, 12);
    expect(doc!.sensitivity.reading).toMatch(/equivalence (not )?shown by the interval: the 90% interval/);
  });

  it('refuses quick-mode options beside a plan', async () => {
    const r = await analyze(['kiln-tiles.plan.yaml', '--data', 'kiln-tiles-wide.csv', '--procedure', 'welch-t']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/--procedure cannot be combined with a plan/);
  });
});

describe('tandem analyze: bad input gives a clear message, never a crash', () => {
  const quick = (file: string, extra: string[] = []) => ['--data', file, '--procedure', 'paired-t', '--first', 'a', '--second', 'b', '--pair-by-row-order', ...extra];

  it('an empty file', async () => {
    const r = await analyze(quick(csv('empty.csv', '')));
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/is empty/);
  });

  it('a single pair: an explicit degenerate result, exit 2', async () => {
    const r = await json(quick(csv('one.csv', 'a,b\n1.5,1.2\n')));
    expect(r.code).toBe(2);
    expect(r.doc!.available).toBe(false);
    expect(r.doc!.unavailable.code).toBe('too-few');
    expect(r.doc!.estimate).toBeNull();
    expect(r.err).toMatch(/cannot be computed/);
  });

  it('all differences zero: says that t is undefined and what it means', async () => {
    const r = await analyze(quick(csv('same.csv', 'a,b\n1.5,1.5\n2.0,2.0\n3.1,3.1\n')));
    expect(r.code).toBe(2);
    expect(r.out).toMatch(/not computed \(no-variation\)/);
    expect(r.out).toMatch(/identical readings on every unit/);
    expect(r.err).toMatch(/no-variation/);
  });

  it('a constant group: reported, not a crash', async () => {
    const r = await json(['--data', csv('flat.csv', 'g,v\nA,2\nA,2\nA,2\nB,3\nB,4\nB,5\n'), '--procedure', 'welch-t', '--group', 'g', '--value', 'v']);
    expect(r.code).toBe(0);
    expect(r.err).toBe('');
    expect(r.doc!.diagnostics[0]).toMatchObject({ label: 'A', sd: 0, shapiro: null });
    expect(r.doc!.diagnostics[0].shapiroNote).toMatch(/all values are equal/);
  });

  it('NaN or Infinity in a cell: named with line and column', async () => {
    const r = await analyze(quick(csv('nan.csv', 'a,b\n1,2\nNaN,3\n4,Infinity\n')));
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/nan\.csv:3:1: 'NaN' is not a measurement/);
    expect(r.err).toMatch(/nan\.csv:4:2: 'Infinity' is not a measurement/);
  });

  it('unknown column names: lists the ones that exist', async () => {
    const r = await analyze(['--data', 'kiln-tiles-wide.csv', '--procedure', 'paired-t', '--first', 'gauge_a', '--second', 'gauge_b_um', '--id', 'tile']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/no column named 'gauge_a'.*'tile', 'gauge_a_um', 'gauge_b_um'/);
  });

  it('unequal counts in wide paired data: stated, and the incomplete pairs counted', async () => {
    const r = await json(quick(csv('short.csv', 'a,b\n1,2\n2,2.5\n3,3.9\n4,4.2\n5,\n6,\n')));
    expect(r.code).toBe(0);
    expect(r.doc!.n).toEqual({ pairs: 4, dropped: 2 });
    expect(r.doc!.warnings.join(' ')).toMatch(/unequal counts: 'a' has 6 values and 'b' has 4/);
  });

  it('enormous values: analysed on their scale, or refused by name', async () => {
    const big = await json(quick(csv('big.csv', 'a,b\n1e300,0.9e300\n1.2e300,1.0e300\n1.1e300,1.05e300\n')));
    expect(big.code).toBe(0);
    expect(Number.isFinite(big.doc!.estimate)).toBe(true);
    expect(big.doc!.estimate / 1e300).toBeCloseTo(mean([0.1, 0.2, 0.05]), 10);
    const over = await analyze(quick(csv('over.csv', 'a,b\n1e400,1\n2,1\n')));
    expect(over.code).toBe(2);
    expect(over.err).toMatch(/beyond the largest number/);
  });

  it('a repeated id in independent data is called pseudo-replication', async () => {
    const r = await analyze(['--data', csv('rep.csv', 'hive,feed,kg\nH1,syrup,3\nH2,fondant,2\nH1,syrup,4\nH3,fondant,2.5\n'), '--procedure', 'welch-t', '--group', 'feed', '--value', 'kg', '--id', 'hive']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/pseudo-replication/);
  });

  it('options: missing --data, an unknown procedure, a margin without equivalence, help', async () => {
    expect((await analyze(['--procedure', 'paired-t'])).err).toMatch(/--data FILE is required/);
    const bad = await analyze(['--data', 'kiln-tiles-wide.csv', '--procedure', 'paired-z']);
    expect(bad.code).toBe(2);
    expect(bad.err).toMatch(/--procedure must be one of paired-t/);
    expect((await analyze([...WIDE, '--margin', '2'])).err).toMatch(/--margin is for the equivalence procedures/);
    expect((await analyze(['--data', 'kiln-tiles-wide.csv', '--procedure', 'paired-equivalence', '--first', 'gauge_a_um', '--second', 'gauge_b_um', '--id', 'tile'])).err).toMatch(/needs --margin/);
    expect((await analyze([...WIDE, '--sensitivity', 'welch-t'])).err).toMatch(/does not fit paired-t; allowed: signed-rank/);
    const help = await analyze(['--help']);
    expect(help.code).toBe(0);
    expect(help.out).toMatch(/Usage:/);
  });

  it('a report file that exists is refused before anything is analysed', async () => {
    const dir = mkdtempSync(join(tmp, 'exists-'));
    writeFileSync(join(dir, 'r.md'), 'keep me');
    const r = await analyze([...WIDE.map((a) => (a === 'kiln-tiles-wide.csv' ? join(FIX, a) : a)), '--report', 'r.md'], { cwd: dir });
    expect(r.code).toBe(3);
    expect(readFileSync(join(dir, 'r.md'), 'utf8')).toBe('keep me');
    expect(existsSync(join(dir, 'r.md'))).toBe(true);
  });
});
