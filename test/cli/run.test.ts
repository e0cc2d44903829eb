import { describe, expect, it } from 'vitest';
import { run } from '../../src/cli/run.js';
import { memoryIO } from '../helpers/io.js';

describe('run(argv, io)', () => {
  it('lists the commands and exits 0 on --help', async () => {
    const io = memoryIO();
    expect(await run(['--help'], io)).toBe(0);
    for (const c of ['advise', 'analyze', 'size', 'audit', 'plan', 'rules', 'demo']) expect(io.out()).toContain(c);
  });
  it('exits 2 with usage when no command is given', async () => {
    const io = memoryIO();
    expect(await run([], io)).toBe(2);
  });
  it('names the unknown command and the known ones, exit 2', async () => {
    const io = memoryIO();
    expect(await run(['analyse-this'], io)).toBe(2);
    expect(io.err()).toMatch(/unknown command 'analyse-this'.*advise/);
  });
  it('prints the version', async () => {
    const io = memoryIO();
    expect(await run(['--version'], io)).toBe(0);
    expect(io.out()).toMatch(/^\d+\.\d+\.\d+\n$/);
  });
});

describe('version', () => {
  it('src/version.ts matches package.json', async () => {
    const { readFileSync } = await import('node:fs');
    const { VERSION } = await import('../../src/version.js');
    const pkg = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version: string };
    expect(VERSION).toBe(pkg.version);
  });
});

describe('option parsing', () => {
  it('takes a negative number as the value of the option before it', async () => {
    const { parseOptions, numberOpt } = await import('../../src/cli/options.js');
    const p = parseOptions(['--null', '-0.5', '--margin', '-.25', '--json'], { null: { type: 'string' }, margin: { type: 'string' }, json: { type: 'boolean' } }, 'analyze');
    expect(numberOpt(p, 'null')).toBe(-0.5);
    expect(numberOpt(p, 'margin')).toBe(-0.25);
    expect(p.values.json).toBe(true);
  });
  it('names the unknown option and lists the allowed ones', async () => {
    const { parseOptions } = await import('../../src/cli/options.js');
    expect(() => parseOptions(['--nul', '1'], { null: { type: 'string' } }, 'analyze')).toThrow(/--nul.*takes: --null, --help/s);
  });
});
