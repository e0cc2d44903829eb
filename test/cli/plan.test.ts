/** `tandem plan check` and `tandem plan show` through `run(argv, io)` with in-memory IO. */
import { describe, expect, it } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { run } from '../../src/cli/run.js';
import { planFromRecommendation, writePlanText } from '../../src/plan/index.js';
import { hiveFeeds, splitLoaves } from '../plan/recommendations.js';
import { memoryIO } from '../helpers/io.js';

function folderWith(files: Record<string, string>): string {
  const d = mkdtempSync(join(tmpdir(), 'tandem-plan-cli-'));
  for (const [name, text] of Object.entries(files)) writeFileSync(join(d, name), text);
  return d;
}

const loaves = (): string => writePlanText(planFromRecommendation(splitLoaves()), 'loaves.plan.yaml');
const hives = (): string => writePlanText(planFromRecommendation(hiveFeeds()), 'hives.plan.yaml');

describe('tandem plan check', () => {
  it('prints OK with a one-line summary and exits 0 for a valid plan', async () => {
    const io = memoryIO({ cwd: folderWith({ 'loaves.plan.yaml': loaves() }) });
    expect(await run(['plan', 'check', 'loaves.plan.yaml'], io)).toBe(0);
    expect(io.out()).toBe('OK loaves.plan.yaml: paired design (split-units); paired-t, two-sided, 95% interval; sensitivity: signed-rank; data: wide\n');
  });

  it('prints every problem with file:line:col and a caret, and exits 1', async () => {
    const text = hives().replace('id: welch-t', 'id: welsh-t').replace('  group: group', '  group: group\n  colour: red');
    const io = memoryIO({ cwd: folderWith({ 'hives.plan.yaml': text }) });
    expect(await run(['plan', 'check', 'hives.plan.yaml'], io)).toBe(1);
    const lines = text.split('\n');
    const idLine = lines.findIndex((l) => l.includes('welsh-t')) + 1;
    const colourLine = lines.findIndex((l) => l.includes('colour: red')) + 1;
    expect(io.out()).toContain(`hives.plan.yaml:${idLine}:7: procedure.id must be equal to one of the allowed values`);
    expect(io.out()).toContain(`  ${idLine} |   id: welsh-t\n  ${' '.repeat(String(idLine).length + 3)}      ^\n`);
    expect(io.out()).toContain(`hives.plan.yaml:${colourLine}:3: unknown key 'colour' in data`);
    expect(io.out()).toMatch(/INVALID hives\.plan\.yaml: 2 problems\n$/);
  });

  it('catches a hand edit that passes the schema but breaks the plan', async () => {
    const text = loaves().replace('id: paired-t', 'id: welch-t');
    const io = memoryIO({ cwd: folderWith({ 'loaves.plan.yaml': text }) });
    expect(await run(['plan', 'check', 'loaves.plan.yaml'], io)).toBe(1);
    expect(io.out()).toMatch(/'welch-t' is for independent designs, but design.family is 'paired'/);
  });

  it('gives one clear message for a newer format version', async () => {
    const io = memoryIO({ cwd: folderWith({ 'future.yaml': loaves().replace('tandem-plan/1', 'tandem-plan/3') }) });
    expect(await run(['plan', 'check', 'future.yaml'], io)).toBe(1);
    expect(io.out()).toMatch(/future\.yaml:\d+:9: this plan is in format tandem-plan\/3, written by a newer tandem/);
    expect(io.out()).toMatch(/INVALID future\.yaml: 1 problem\n$/);
  });

  it('exits 2 for a missing file and checks the others', async () => {
    const io = memoryIO({ cwd: folderWith({ 'loaves.plan.yaml': loaves() }) });
    expect(await run(['plan', 'check', 'gone.yaml', 'loaves.plan.yaml'], io)).toBe(2);
    expect(io.err()).toBe('tandem plan: cannot read plan gone.yaml: no such file\n');
    expect(io.out()).toMatch(/^OK loaves\.plan\.yaml/);
  });

  it('exits 2 without a file or with an unknown subcommand', async () => {
    const io = memoryIO();
    expect(await run(['plan', 'check'], io)).toBe(2);
    expect(io.err()).toMatch(/plan check needs a plan file/);
    const io2 = memoryIO();
    expect(await run(['plan', 'verify', 'x.yaml'], io2)).toBe(2);
    expect(io2.err()).toMatch(/unknown plan subcommand 'verify' \(allowed: check, show\)/);
  });

  it('prints help', async () => {
    const io = memoryIO();
    expect(await run(['plan', '--help'], io)).toBe(0);
    expect(io.out()).toMatch(/tandem plan check FILE/);
  });
});

describe('tandem plan show', () => {
  it('describes a valid plan in words', async () => {
    const io = memoryIO({ cwd: folderWith({ 'hives.plan.yaml': hives() }) });
    expect(await run(['plan', 'show', 'hives.plan.yaml'], io)).toBe(0);
    expect(io.out()).toMatch(/^Pollen patty versus Sugar syrup: honey yield\n/);
    expect(io.out()).toContain("Data: one row per unit; group in column 'group' ('Pollen patty' or 'Sugar syrup'), value in 'honey_yield'");
    expect(io.out()).toContain('Procedure: Welch two-sample t [welch-t], greater, 95% interval, null value 0');
  });

  it('refuses an invalid plan with its problems and exit 2', async () => {
    const io = memoryIO({ cwd: folderWith({ 'bad.yaml': 'format: tandem-plan/1\ntitle: x\n' }) });
    expect(await run(['plan', 'show', 'bad.yaml'], io)).toBe(2);
    expect(io.err()).toMatch(/bad\.yaml is not a valid plan; nothing to show/);
    expect(io.err()).toMatch(/missing the required key 'study'/);
  });
});
