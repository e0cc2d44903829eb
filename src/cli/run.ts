/**
 * The command-line entry as a function: `run(argv, io)` returns an exit code and never throws.
 * Commands load lazily so that a scripted command does not pay for the interview's modules.
 */
import type { IO } from './io.js';
import { EXIT } from './exit-codes.js';
import { CancelledError, InputError, OutputError, StatsError } from '../errors.js';
import { formatProblem } from '../problems.js';
import { VERSION } from '../version.js';

export type Command = (argv: string[], io: IO) => Promise<number>;

interface CommandEntry {
  summary: string;
  load: () => Promise<{ default: Command }>;
}

export const COMMANDS: Record<string, CommandEntry> = {
  advise: { summary: 'interview about how the data were produced; recommend design, procedure and plan', load: () => import('./commands/advise.js') },
  analyze: { summary: 'run an analysis plan (or a named procedure) on a CSV file', load: () => import('./commands/analyze.js') },
  size: { summary: 'sample size and power for paired versus independent designs', load: () => import('./commands/size.js') },
  audit: { summary: "check a colleague's method and reported numbers", load: () => import('./commands/audit.js') },
  plan: { summary: 'validate an analysis plan file (plan check FILE)', load: () => import('./commands/plan.js') },
  rules: { summary: 'validate the rule base and prove it complete (rules check)', load: () => import('./commands/rules.js') },
  demo: { summary: 'a non-interactive end-to-end example on a bundled, invented scenario', load: () => import('./commands/demo.js') },
};

export function usage(): string {
  const width = Math.max(...Object.keys(COMMANDS).map((k) => k.length));
  const lines = Object.entries(COMMANDS).map(([k, c]) => `  ${k.padEnd(width)}  ${c.summary}`);
  return [
    `tandem ${VERSION}: paired or independent? Decide, plan, analyse, size and audit two-condition comparisons.`,
    '',
    'Usage: tandem <command> [options]',
    '',
    'Commands:',
    ...lines,
    '',
    "Run 'tandem <command> --help' for a command's options.",
    'Exit codes: 0 ok, 1 problems found, 2 bad input, 3 output not written, 70 internal error, 130 cancelled.',
    '',
  ].join('\n');
}

export async function run(argv: string[], io: IO): Promise<number> {
  const [name, ...rest] = argv;
  if (name === undefined || name === '--help' || name === '-h' || name === 'help') {
    io.stdout.write(usage());
    return name === undefined ? EXIT.input : EXIT.ok;
  }
  if (name === '--version' || name === '-V') {
    io.stdout.write(`${VERSION}\n`);
    return EXIT.ok;
  }
  const entry = Object.prototype.hasOwnProperty.call(COMMANDS, name) ? COMMANDS[name] : undefined;
  if (!entry) {
    io.stderr.write(`tandem: unknown command '${name}' (commands: ${Object.keys(COMMANDS).join(', ')})\n`);
    return EXIT.input;
  }
  try {
    const mod = await entry.load();
    return await mod.default(rest, io);
  } catch (err) {
    return reportError(err, io, name);
  }
}

/** Maps the error kinds to exit codes; an unexpected error is reported as a bug, without a stack. */
export function reportError(err: unknown, io: IO, command: string): number {
  if (err instanceof CancelledError) {
    io.stderr.write(`tandem ${command}: ${err.message}\n`);
    return EXIT.cancelled;
  }
  if (err instanceof InputError) {
    io.stderr.write(`tandem ${command}: ${err.message}\n`);
    for (const p of err.problems) io.stderr.write(`  ${formatProblem(p).replace(/\n/g, '\n  ')}\n`);
    return EXIT.input;
  }
  if (err instanceof StatsError) {
    io.stderr.write(`tandem ${command}: cannot compute (${err.code}): ${err.message}\n`);
    return EXIT.input;
  }
  if (err instanceof OutputError) {
    io.stderr.write(`tandem ${command}: ${err.message}\n`);
    return EXIT.output;
  }
  const msg = err instanceof Error ? err.message : String(err);
  io.stderr.write(`tandem ${command}: internal error: ${msg}\nThis is a bug in tandem; please report it with the command you ran.\n`);
  if (io.env.TANDEM_DEBUG && err instanceof Error && err.stack) io.stderr.write(err.stack + '\n');
  return EXIT.internal;
}
