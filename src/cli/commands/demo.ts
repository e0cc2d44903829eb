/**
 * `tandem demo`: the whole job on a bundled, invented scenario, without a terminal. It runs the
 * same commands a user would: advise (answers file -> recommendation and plan), plan check, then
 * analyze (plan + CSV), and finally size for a follow-up study. The plan is written to a fresh
 * temporary folder unless --out names one.
 */
import { mkdtemp } from 'node:fs/promises';
import { existsSync, mkdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative, resolve } from 'node:path';
import type { IO } from '../io.js';
import { EXIT } from '../exit-codes.js';
import { boolOpt, parseOptions, stringOpt } from '../options.js';
import { examplesDir } from '../../paths.js';
import { makeStyle } from '../../report/style.js';

const HELP = `tandem demo [--out DIR] [--force]

Runs tandem end to end on a bundled, invented scenario: a bridge-maintenance crew compares a new
handheld ultrasonic gauge with its bench gauge on 25 steel plates (examples/demo/).
  1. tandem advise --answers examples/demo/answers.yaml --plan DIR/gauge.plan.yaml
  2. tandem plan check DIR/gauge.plan.yaml
  3. tandem analyze DIR/gauge.plan.yaml --data examples/demo/gauge-readings.csv
  4. tandem size DIR/gauge.plan.yaml --difference 0.05 --sd-diff 0.08  (a follow-up study)

Options:
  --out DIR   where to write the plan (default: a new temporary folder)
  --force     replace DIR/gauge.plan.yaml if it exists
Exit codes: 0 done; otherwise the exit code of the step that failed.
`;

export default async function demo(argv: string[], io: IO): Promise<number> {
  const p = parseOptions(argv, { out: { type: 'string' }, force: { type: 'boolean' } }, 'demo');
  if (p.values.help) {
    io.stdout.write(HELP);
    return EXIT.ok;
  }
  const out = stringOpt(p, 'out');
  const dir = out === undefined ? await mkdtemp(join(tmpdir(), 'tandem-demo-')) : resolve(io.cwd, out);
  if (!existsSync(dir)) mkdirSync(dir, { recursive: true });
  const ex = join(examplesDir(), 'demo');
  const show = (f: string): string => (relative(io.cwd, f).startsWith('..') ? f : relative(io.cwd, f) || f);
  const plan = join(dir, 'gauge.plan.yaml');
  const style = makeStyle(io.color);
  const { run } = await import('../run.js');
  const steps: { title: string; argv: string[] }[] = [
    { title: 'classify the design and write the plan', argv: ['advise', '--answers', join(ex, 'answers.yaml'), '--plan', plan, ...(boolOpt(p, 'force') ? ['--force'] : [])] },
    { title: 'check the plan file', argv: ['plan', 'check', plan] },
    { title: 'run the plan on the data', argv: ['analyze', plan, '--data', join(ex, 'gauge-readings.csv')] },
    { title: 'size a follow-up study', argv: ['size', plan, '--difference', '0.05', '--sd-diff', '0.08'] },
  ];
  for (const [i, s] of steps.entries()) {
    const shown = s.argv.map((a) => (a.startsWith('/') ? show(a) : a)).join(' ');
    io.stdout.write(`\n${style.bold(`Step ${i + 1} of ${steps.length}: ${s.title}`)}\n${style.dim(`$ tandem ${shown}`)}\n\n`);
    const code = await run(s.argv, io);
    if (code !== EXIT.ok) {
      io.stderr.write(`tandem demo: step ${i + 1} (${s.argv[0]}) ended with exit code ${code}\n`);
      return code;
    }
  }
  io.stdout.write(`\n${style.bold('Done.')} The plan is at ${show(plan)}; the data at ${show(join(ex, 'gauge-readings.csv'))}.\n`);
  return EXIT.ok;
}
