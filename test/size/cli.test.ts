/**
 * `tandem size` through run(argv, io) with in-memory IO: the answer sentence, the JSON shape,
 * exit codes for bad input, and reading and writing a plan's planning section.
 */
import { copyFileSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { run } from '../../src/cli/run.js';
import { memoryIO } from '../helpers/io.js';

const PLANS = new URL('../fixtures/size-plans/', import.meta.url).pathname;

async function size(args: string[], cwd?: string): Promise<{ code: number; out: string; err: string }> {
  const io = memoryIO({ cwd });
  const code = await run(['size', ...args], io);
  return { code, out: io.out(), err: io.err() };
}

const dirs: string[] = [];
function scratch(): string {
  const d = mkdtempSync(join(tmpdir(), 'tandem-size-'));
  dirs.push(d);
  return d;
}
afterEach(() => {
  while (dirs.length) rmSync(dirs.pop() as string, { recursive: true, force: true });
});

describe('tandem size: answers', () => {
  it('answers in one sentence, in the outcome units, with attrition', async () => {
    const r = await size(['--design', 'paired', '--difference', '2.5', '--sd-diff', '4', '--attrition', '0.1', '--unit', 'mm']);
    expect(r.code).toBe(0);
    expect(r.out.split('\n')[0]).toBe(
      'To detect a mean difference of 2.5 mm (SD of differences 4 mm) with 80% power at two-sided alpha 0.05 you need 23 pairs; recruit 26 to allow for 10% attrition.',
    );
    expect(r.out).toContain('Power against pairs');
    expect(r.out).toContain('does not replace a qualified statistician');
    expect(r.out).not.toMatch(/\x1b\[/); // no colour codes when colour is off
  });
  it('shows what pairing buys when SD and correlation are given', async () => {
    const r = await size(['--design', 'paired', '--difference', '2.5', '--sd', '4', '--rho', '0.5']);
    expect(r.code).toBe(0);
    expect(r.out).toContain('What pairing buys');
    expect(r.out).toMatch(/0\.5 \*\s+4\s+23\s+46\s+84 \(42 \+ 42\)\s+38/);
  });
  it('--json carries n, total, power and inputs', async () => {
    const r = await size(['--design', 'independent', '--effect-size', '0.5', '--ratio', '2', '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j).toMatchObject({ question: 'sample-size', design: 'independent', n: 48, n2: 96, total: 144 });
    expect(j.power).toBeGreaterThanOrEqual(0.8);
    expect(j.inputs).toMatchObject({ design: 'independent', effectSize: 0.5, ratio: 2 });
    expect(j.comparison).toHaveLength(5);
    expect(j.curve.length).toBeGreaterThan(10);
  });
  it('--n with an effect gives the power; --n alone the smallest detectable difference', async () => {
    const p = JSON.parse((await size(['--design', 'paired', '--effect-size', '0.5', '--n', '34', '--json'])).out);
    expect(p.question).toBe('power');
    expect(p.power).toBeGreaterThan(0.8);
    const d = await size(['--design', 'paired', '--sd-diff', '4', '--n', '23', '--unit', 'mm']);
    expect(d.out).toMatch(/With 23 pairs and 80% power at two-sided alpha 0.05, the smallest true difference you can expect to detect is 2\.4\d* mm/);
  });
  it('equivalence: two one-sided tests', async () => {
    const r = await size(['--design', 'paired', '--sd-diff', '1', '--margin', '0.6', '--json']);
    const j = JSON.parse(r.out);
    expect(j.method).toMatch(/two one-sided tests/);
    expect(j.notes.join(' ')).toMatch(/assumed to be 0/);
  });
  it('takes negative values after an option (a difference in the other direction)', async () => {
    const r = await size(['--design', 'paired', '--difference', '-2.5', '--sd-diff', '4', '--alternative', 'less', '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.difference).toBe(-2.5);
    expect(j.n).toBe(JSON.parse((await size(['--design', 'paired', '--difference', '2.5', '--sd-diff', '4', '--alternative', 'greater', '--json'])).out).n);
  });
  it('--help lists the options and exit codes', async () => {
    const r = await size(['--help']);
    expect(r.code).toBe(0);
    for (const o of ['--design', '--difference', '--sd-diff', '--rho', '--effect-size', '--ratio', '--sd2', '--attrition', '--n', '--margin', '--json', '--plan']) {
      expect(r.out).toContain(o);
    }
  });
});

describe('tandem size: bad input exits 2 with a message naming the option', () => {
  it.each([
    [['--design', 'paired', '--difference', '1', '--sd-diff', '0'], /--sd-diff must be a positive number/],
    [['--design', 'paired', '--difference', '1', '--sd', '2', '--rho', '1.2'], /--rho must be a correlation strictly between -1 and 1; got 1.2/],
    [['--design', 'paired', '--difference', '0', '--sd-diff', '2'], /difference of 0 cannot be detected/],
    [['--design', 'paired', '--difference', '1', '--sd-diff', '2', '--power', '1.1'], /--power must be a probability/],
    [['--design', 'paired', '--difference', '1', '--sd-diff', '2', '--margin', '0.5'], /--margin 0.5 must be larger/],
    [['--design', 'triple', '--difference', '1'], /--design must be one of paired, independent/],
    [['--design', 'paired', '--bogus', '1'], /'size' takes:/],
    [['--design', 'paired', '--difference', 'abc', '--sd-diff', '1'], /--difference must be a number; got 'abc'/],
    [[], /say which design to plan: --design paired or --design independent/],
  ])('%j', async (args, message) => {
    const r = await size(args);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(message);
    expect(r.out).toBe('');
  });
});

describe('tandem size PLAN and --plan', () => {
  it('reads the planning section, the design and the study words from a plan', async () => {
    const r = await size([join(PLANS, 'glaze-halves.plan.yaml')]);
    expect(r.code).toBe(0);
    expect(r.out.split('\n')[0]).toBe(
      'To detect a mean difference in glaze layer thickness (slow ramp minus usual ramp) of 6 um (SD 11 um, correlation 0.6 within pairs, so SD of differences 9.839 um) with 80% power at two-sided alpha 0.05 you need 24 pairs; recruit 27 to allow for 10% attrition.',
    );
  });
  it('takes the alternative from the plan and lets options override planning values', async () => {
    const r = await size([join(PLANS, 'ferry-gates.plan.yaml'), '--power', '0.8', '--json']);
    const j = JSON.parse(r.out);
    expect(j.assumed).toMatchObject({ alternative: 'less', power: 0.8 });
    expect(j.n).toBeLessThan(79); // the plan's 0.9 needs 79 per group
  });
  it('points a bad planning value at the plan file', async () => {
    const dir = scratch();
    const f = join(dir, 'bad.plan.yaml');
    const text = readFileSync(join(PLANS, 'glaze-halves.plan.yaml'), 'utf8').replace('rho: 0.6', 'rho: 1.4');
    copyFileSync(join(PLANS, 'glaze-halves.plan.yaml'), f);
    await import('node:fs').then((fs) => fs.writeFileSync(f, text));
    const r = await size([f]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/planning value rho in .*bad\.plan\.yaml must be a correlation strictly between -1 and 1; got 1\.4/);
  });
  it('--plan needs --force, then rewrites only the planning section (comments kept)', async () => {
    const dir = scratch();
    const f = join(dir, 'glaze.plan.yaml');
    copyFileSync(join(PLANS, 'glaze-halves.plan.yaml'), f);
    const before = readFileSync(f, 'utf8');
    const args = ['--design', 'paired', '--difference', '5', '--sd-diff', '8', '--power', '0.9', '--plan', f];
    const refused = await size(args);
    expect(refused.code).toBe(3);
    expect(refused.out).toBe('');
    expect(readFileSync(f, 'utf8')).toBe(before);

    const ok = await size([...args, '--force']);
    expect(ok.code).toBe(0);
    const after = readFileSync(f, 'utf8');
    expect(after).toContain('# Invented scenario for the size tests');
    expect(after).toContain('# Planning inputs for \'tandem size\'');
    expect(after).toMatch(/planning:\n(.*\n)*\s+difference: 5 # the smallest change/);
    expect(after).toContain('sdDiff: 8');
    expect(after).not.toMatch(/^\s+rho:/m); // stale inputs that would conflict are removed
    expect(after).not.toMatch(/^\s+sd: 11/m);
    // Reading it back gives the same answer.
    const again = JSON.parse((await size([f, '--json'])).out);
    const direct = JSON.parse((await size([...args.slice(0, -2), '--json'])).out);
    expect(again.n).toBe(direct.n);
  });
  it('--plan writes a Welch plan\'s second SD back, and the plan stays valid', async () => {
    const dir = scratch();
    const f = join(dir, 'ferry.plan.yaml');
    copyFileSync(join(PLANS, 'ferry-gates.plan.yaml'), f);
    const args = ['--design', 'independent', '--difference', '-3', '--sd', '6', '--sd2', '9', '--alternative', 'less', '--plan', f, '--force'];
    const ok = await size(args);
    expect(ok.code).toBe(0);
    expect(readFileSync(f, 'utf8')).toMatch(/^\s+sd2: 9/m);
    const { readPlan } = await import('../../src/plan/read.js');
    expect((await readPlan(f)).planning?.sd2).toBe(9);
    const again = JSON.parse((await size([f, '--json'])).out);
    const direct = JSON.parse((await size([...args.slice(0, -3), '--json'])).out);
    expect(again.n).toBe(direct.n);
  });
  it('refuses a plan whose design is not paired or independent, or that contradicts --design', async () => {
    const r = await size([join(PLANS, 'glaze-halves.plan.yaml'), '--design', 'independent']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/--design independent contradicts the plan, whose design is paired/);
  });
});
