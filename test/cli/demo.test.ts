import { describe, expect, it } from 'vitest';
import { existsSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { run } from '../../src/cli/run.js';
import { memoryIO } from '../helpers/io.js';

describe('tandem demo', () => {
  it('runs advise, plan check, analyze and size on the bundled scenario and writes a valid plan', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'tandem-demo-test-'));
    const io = memoryIO();
    expect(await run(['demo', '--out', dir], io)).toBe(0);
    const plan = join(dir, 'gauge.plan.yaml');
    expect(existsSync(plan)).toBe(true);
    const out = io.out();
    for (const s of ['Step 1 of 4', 'DESIGN', 'HYPOTHESES', 'Result: paired t on the differences', 'Sensitivity analysis: Wilcoxon signed-rank', 'Conclusion', 'you need']) expect(out).toContain(s);
    expect(out).toMatch(/24 pairs, 1 dropped/);
    const check = memoryIO();
    expect(await run(['plan', 'check', plan], check)).toBe(0);
  });
  it('refuses to replace an existing plan without --force (exit 3), then replaces it with --force', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'tandem-demo-test-'));
    expect(await run(['demo', '--out', dir], memoryIO())).toBe(0);
    const again = memoryIO();
    expect(await run(['demo', '--out', dir], again)).toBe(3);
    expect(again.err()).toMatch(/exists/);
    expect(await run(['demo', '--out', dir, '--force'], memoryIO())).toBe(0);
  });
});
