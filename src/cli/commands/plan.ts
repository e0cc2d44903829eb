/**
 * `tandem plan check FILE...`: validates analysis plan files (written by tandem advise or edited
 * by hand) against the committed schema and the checks beyond it; prints OK with a one-line
 * summary, or every problem at its line and column with a caret.
 * `tandem plan show FILE`: the plan in words.
 * Exit codes: 0 valid, 1 problems found, 2 a file missing or unreadable (or a bad option).
 */
import type { IO } from '../io.js';
import { EXIT } from '../exit-codes.js';
import { parseOptions } from '../options.js';
import { InputError } from '../../errors.js';
import { formatProblem, type Problem } from '../../problems.js';
import { makeStyle } from '../../report/style.js';
import { checkPlanText, describePlan, planSummary, readPlanSource } from '../../plan/index.js';
import { resolve } from 'node:path';

const HELP = `Usage:
  tandem plan check FILE...   validate analysis plan files (format tandem-plan/1)
  tandem plan show FILE       describe a plan in words

A plan is written by 'tandem advise --plan FILE' and may be edited by hand (most often its data
section, to match the CSV file's column names). 'plan check' reports every problem with its file,
line and column; it also catches plans whose parts disagree (a procedure that does not fit the
design, an equivalence test without a margin, a data layout the procedure cannot read).

Examples:
  tandem plan check hive-weights.plan.yaml
  tandem plan show hive-weights.plan.yaml

Exit codes: 0 valid, 1 problems found, 2 file missing or unreadable, or a bad option.
`;

export default async function plan(argv: string[], io: IO): Promise<number> {
  const parsed = parseOptions(argv, {}, 'plan');
  const [sub, ...files] = parsed.positionals;
  if (parsed.values.help) {
    io.stdout.write(HELP);
    return EXIT.ok;
  }
  if (sub !== 'check' && sub !== 'show') {
    throw new InputError(sub === undefined ? "plan needs a subcommand: 'plan check FILE' or 'plan show FILE'" : `unknown plan subcommand '${sub}' (allowed: check, show)`);
  }
  if (files.length === 0) throw new InputError(`plan ${sub} needs a plan file, e.g. tandem plan ${sub} study.plan.yaml`);
  if (sub === 'show' && files.length > 1) throw new InputError('plan show takes one file');
  return sub === 'check' ? check(files, io) : show(files[0], io);
}

function printProblems(problems: Problem[], source: string, out: IO['stdout'], io: IO): void {
  const style = makeStyle(io.color);
  for (const p of problems) {
    const [head, ...rest] = formatProblem(p, source).split('\n');
    out.write(`${style.bad(head)}\n${rest.map((l) => `${l}\n`).join('')}`);
  }
}

async function check(files: string[], io: IO): Promise<number> {
  const style = makeStyle(io.color);
  let code: number = EXIT.ok;
  for (const file of files) {
    let source: string;
    try {
      source = await readPlanSource(resolve(io.cwd, file));
    } catch (err) {
      if (!(err instanceof InputError)) throw err;
      io.stderr.write(`tandem plan: ${err.message.replace(resolve(io.cwd, file), file)}\n`);
      code = EXIT.input;
      continue;
    }
    const result = checkPlanText(source, file);
    if (result.plan) {
      io.stdout.write(`${style.good('OK')} ${file}: ${planSummary(result.plan)}\n`);
      continue;
    }
    printProblems(result.problems, source, io.stdout, io);
    const n = result.problems.length;
    io.stdout.write(`${style.bad('INVALID')} ${file}: ${n} problem${n === 1 ? '' : 's'}\n`);
    if (code === EXIT.ok) code = EXIT.findings;
  }
  return code;
}

async function show(file: string, io: IO): Promise<number> {
  let source: string;
  try {
    source = await readPlanSource(resolve(io.cwd, file));
  } catch (err) {
    if (err instanceof InputError) throw new InputError(err.message.replace(resolve(io.cwd, file), file));
    throw err;
  }
  const result = checkPlanText(source, file);
  if (!result.plan) {
    io.stderr.write(`tandem plan: ${file} is not a valid plan; nothing to show\n`);
    printProblems(result.problems, source, io.stderr, io);
    return EXIT.input;
  }
  io.stdout.write(describePlan(result.plan));
  return EXIT.ok;
}
