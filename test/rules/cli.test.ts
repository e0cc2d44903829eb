/** `tandem rules check|list`: summary, problems with positions, and the documented exit codes. */
import { describe, expect, test } from 'vitest';
import { run } from '../../src/cli/run.js';
import { memoryIO } from '../helpers/io.js';
import { TINY, writeRules } from './tiny-rules.js';

describe('tandem rules', () => {
  test('check on a clean rule base prints the summary and exits 0', async () => {
    const io = memoryIO();
    expect(await run(['rules', 'check', '--dir', writeRules()], io)).toBe(0);
    expect(io.out()).toMatch(/answer paths enumerated\s+12/);
    expect(io.out()).toMatch(/staves\s+10/);
    expect(io.out()).toContain('rules check: OK');
  });

  test('--rules DIR (the name advise and audit use) works like --dir DIR', async () => {
    const io = memoryIO();
    expect(await run(['rules', 'check', '--rules', writeRules()], io)).toBe(0);
    expect(io.out()).toMatch(/staves\s+10/);
  });

  test('check reports problems with file:line:col and a caret, and exits 1', async () => {
    const dir = writeRules({ 'designs.yaml': TINY['designs.yaml'].replace('{ fact: layout, equals: same }', '{ fact: layout, resembles: same }') });
    const io = memoryIO();
    expect(await run(['rules', 'check', '--dir', dir], io)).toBe(1);
    expect(io.out()).toMatch(/designs\.yaml:\d+:\d+: rule 'rule-staves': unknown operator 'resembles'/);
    expect(io.out()).toMatch(/\n\s+\d+ \| .*resembles.*\n\s+\^/);
  });

  test('check on an incomplete rule base exits 1', async () => {
    const dir = writeRules({ 'designs.yaml': TINY['designs.yaml'].replace('when: { fact: layout, equals: different }', 'when: { all: [{ fact: layout, equals: different }, { fact: direction, equals: first-higher }] }') });
    const io = memoryIO();
    expect(await run(['rules', 'check', '--dir', dir], io)).toBe(1);
    expect(io.out()).toMatch(/no classification rule holds for: .*layout=different/);
  });

  test('a directory that cannot be read exits 2', async () => {
    const io = memoryIO();
    expect(await run(['rules', 'check', '--dir', '/nonexistent/tandem-rules'], io)).toBe(2);
    expect(io.err()).toMatch(/does not exist/);
  });

  test('list shows designs and procedures, and the questions with --questions', async () => {
    const io = memoryIO();
    expect(await run(['rules', 'list', '--questions'], io)).toBe(0);
    expect(io.out()).toMatch(/crossover\s+paired/);
    expect(io.out()).toContain('outcome_type');
    expect(io.out()).toContain('continuous | count | ordinal | binary');
  });

  test('--help, and bad subcommands', async () => {
    const help = memoryIO();
    expect(await run(['rules', '--help'], help)).toBe(0);
    expect(help.out()).toContain('Exit codes: 0 clean, 1 problems found, 2');
    const bad = memoryIO();
    expect(await run(['rules', 'verify'], bad)).toBe(2);
    expect(bad.err()).toContain("unknown rules subcommand 'verify'");
    const none = memoryIO();
    expect(await run(['rules'], none)).toBe(2);
  });
});
