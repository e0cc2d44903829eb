/**
 * Every audit case in cases/audit/*.yaml, run through the command as a user would
 * (`tandem audit CASE --json [--data FILE]`): the codes listed under `expect.codes` must appear,
 * those under `expect.absent` must not, and the exit code must match `expect.exit` when given.
 * The numbers in the cases come from test/fixtures/scipy-audit/cases.py (invented data, scipy).
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { parse } from 'yaml';
import { FINDING_CODES } from '../../src/audit/codes.js';
import { run } from '../../src/cli/run.js';
import { memoryIO } from '../helpers/io.js';

const dir = fileURLToPath(new URL('../../cases/audit/', import.meta.url));
const files = readdirSync(dir).filter((f) => f.endsWith('.yaml')).sort();

interface Expect { codes?: string[]; absent?: string[]; exit?: number; data?: string }

const seen = new Set<string>();

describe('audit cases', () => {
  it('there are at least 15 cases, sound and flawed', () => {
    expect(files.length).toBeGreaterThanOrEqual(15);
    const exits = files.map((f) => (parse(readFileSync(join(dir, f), 'utf8')) as { expect?: Expect }).expect?.exit);
    expect(exits.filter((e) => e === 0).length).toBeGreaterThanOrEqual(3);
    expect(exits.filter((e) => e === 1).length).toBeGreaterThanOrEqual(10);
  });
  for (const f of files) {
    it(f, async () => {
      const doc = parse(readFileSync(join(dir, f), 'utf8')) as { expect?: Expect; study?: Record<string, unknown> };
      const ex = doc.expect ?? {};
      for (const c of [...(ex.codes ?? []), ...(ex.absent ?? [])]) expect(Object.keys(FINDING_CODES), `unknown code ${c} in ${f}`).toContain(c);
      const io = memoryIO({ cwd: dir });
      const code = await run(['audit', f, '--json', ...(ex.data ? ['--data', ex.data] : [])], io);
      expect(io.err(), `stderr of ${f}`).toBe('');
      const out = JSON.parse(io.out()) as { findings: { code: string; severity: string; message: string }[] };
      const found = out.findings.map((x) => x.code);
      found.forEach((c) => seen.add(c));
      if (doc.study?.answers || doc.study?.answersFile || doc.study?.planFile) {
        expect(found, `${f}: its study facts must classify (${out.findings.find((x) => x.code === 'design-unknown')?.message ?? ''})`).not.toContain('design-unknown');
      }
      for (const c of ex.codes ?? []) expect(found, `${f} should report ${c}`).toContain(c);
      for (const c of ex.absent ?? []) expect(found, `${f} should not report ${c}`).not.toContain(c);
      if (ex.exit !== undefined) expect(code, `exit code of ${f} (findings: ${found.join(', ')})`).toBe(ex.exit);
      expect(code).toBe(out.findings.some((x) => x.severity === 'error') ? 1 : 0);
    });
  }
  it('together the cases show a wide range of findings', () => {
    expect(seen.size, [...seen].sort().join(', ')).toBeGreaterThanOrEqual(25);
  });
});
