/**
 * `tandem rules check [--dir DIR]`: loads and validates every rule file (problems with file, line
 * and column), then enumerates every reachable answer path and proves that each ends in exactly
 * one outcome; rules never matched and questions never asked are reported.
 * `tandem rules list [--dir DIR] [--questions]`: the designs, procedures and (optionally) the
 * questions of the rule base.
 * Exit codes: 0 clean, 1 problems found, 2 the directory cannot be read (or a bad option).
 */
import { resolve } from 'node:path';
import type { IO } from '../io.js';
import { EXIT } from '../exit-codes.js';
import { boolOpt, parseOptions, stringOpt } from '../options.js';
import { InputError } from '../../errors.js';
import { formatProblem, type Problem } from '../../problems.js';
import { makeStyle, textTable } from '../../report/style.js';
import { rulesDir } from '../../paths.js';
import { checkRuleBase, loadRuleBase, readRuleBase } from '../../engine/index.js';
import type { RuleBase } from '../../engine/model.js';
import { questionAsShown } from '../../engine/templates.js';

const HELP = `Usage:
  tandem rules check [--dir DIR]               validate the rule base and prove it complete
  tandem rules list [--dir DIR] [--questions]  list designs and procedures (and questions)

The rule base (rules/*.yaml) holds the interview's questions, the designs, the classification
rules, the procedures catalogue, the conditions to check, the statements, warnings and cautions.
'rules check' reports every problem with file, line and column (malformed YAML, unknown keys,
wrong types, duplicate ids, dangling references, unknown operators), then enumerates every
reachable answer path and proves that each ends in exactly one design, one procedure selection,
one difference statement, one hypotheses entry and one scope entry. Rules that never apply and
questions that are never asked are reported too.

Options:
  --dir DIR      a rule directory other than the bundled one (--rules DIR, as in advise and
                 audit, is the same)
  --questions    (list) also show the questions, their ids and choice values

Exit codes: 0 clean, 1 problems found, 2 the directory cannot be read or a bad option.
`;

export default async function rules(argv: string[], io: IO): Promise<number> {
  // --rules is the name advise and audit use for the same folder; both are accepted here.
  const parsed = parseOptions(argv, { dir: { type: 'string' }, rules: { type: 'string' }, questions: { type: 'boolean' } }, 'rules');
  if (parsed.values.help) {
    io.stdout.write(HELP);
    return EXIT.ok;
  }
  const [sub, ...extra] = parsed.positionals;
  if (sub !== 'check' && sub !== 'list') {
    throw new InputError(sub === undefined ? "rules needs a subcommand: 'rules check' or 'rules list'" : `unknown rules subcommand '${sub}' (allowed: check, list)`);
  }
  if (extra.length) throw new InputError(`rules ${sub} takes no file arguments (got '${extra.join(' ')}'); use --dir DIR for another rule directory`);
  const dirOpt = stringOpt(parsed, 'dir') ?? stringOpt(parsed, 'rules');
  const dir = dirOpt === undefined ? rulesDir() : resolve(io.cwd, dirOpt);
  if (sub === 'list') return list(loadRuleBase(dir), boolOpt(parsed, 'questions'), io);
  return check(dir, io);
}

function printProblems(problems: Problem[], sources: Map<string, string>, io: IO): void {
  const style = makeStyle(io.color);
  for (const p of problems) {
    const [head, ...rest] = formatProblem(p, p.file ? sources.get(p.file) : undefined).split('\n');
    io.stdout.write(`${style.bad(head)}\n${rest.map((l) => `${l}\n`).join('')}`);
  }
}

function check(dir: string, io: IO): number {
  const style = makeStyle(io.color);
  const read = readRuleBase(dir); // InputError (exit 2) when the directory cannot be read
  if (!read.rb) {
    printProblems(read.problems, read.sources, io);
    io.stdout.write(style.bad(`rules check: ${read.problems.length} problem${read.problems.length === 1 ? '' : 's'} in ${read.files.length} file${read.files.length === 1 ? '' : 's'}; the completeness check did not run\n`));
    return EXIT.findings;
  }
  const report = checkRuleBase(read.rb);
  const rows: string[][] = [
    ['files', String(report.files)],
    ['questions', String(report.questions)],
    ['designs', String(report.designs)],
    ['classification rules', String(report.rules)],
    ['procedures', String(report.procedures)],
    ['answer paths enumerated', String(report.paths)],
  ];
  io.stdout.write(`${style.bold('Rule base')} ${dir}\n${textTable(rows, { right: [1], indent: '  ' })}\n`);
  io.stdout.write(style.dim('  (choice answers branch; numbers take values on both sides of every threshold; answers that change only\n   wording, warnings or cautions are varied across paths rather than multiplied)\n'));
  const count = (o: Record<string, number>): string => textTable(Object.entries(o).sort((a, b) => b[1] - a[1]).map(([k, v]) => [k, String(v)]), { right: [1], indent: '  ' });
  io.stdout.write(`${style.bold('Paths by design')}\n${count(report.outcomes)}\n`);
  io.stdout.write(`${style.bold('Paths by procedure')}\n${count(report.procedureCounts)}\n`);
  if (report.problems.length) {
    printProblems(report.problems, read.sources, io);
    io.stdout.write(style.bad(`rules check: ${report.problems.length} problem${report.problems.length === 1 ? '' : 's'}\n`));
    return EXIT.findings;
  }
  io.stdout.write(style.good('rules check: OK, every answer path ends in exactly one outcome\n'));
  return EXIT.ok;
}

function list(rb: RuleBase, withQuestions: boolean, io: IO): number {
  const style = makeStyle(io.color);
  const designs = [...rb.designs.values()].map((d) => [d.kind, d.family, d.label]);
  io.stdout.write(`${style.bold('Designs')}\n${textTable([['kind', 'family', 'label'], ...designs], { indent: '  ' })}\n`);
  const procs = [...rb.procedures.values()].map((p) => [p.id, p.name]);
  io.stdout.write(`${style.bold('Procedures')}\n${textTable([['id', 'name'], ...procs], { indent: '  ' })}\n`);
  if (withQuestions) {
    io.stdout.write(`${style.bold('Questions')} (in asking order; some are asked only when earlier answers make them matter)\n`);
    for (const q of rb.questions) {
      const kind = q.type === 'choice' ? (q.choices ?? []).map((c) => c.value).join(' | ') : q.type + (q.optional ? ', optional' : '');
      io.stdout.write(`  ${style.accent(q.id)}  ${questionAsShown(q, {}).text}\n      ${style.dim(kind)}${q.guard ? style.dim('  (conditional)') : ''}\n`);
    }
  } else {
    io.stdout.write(style.dim(`${rb.questions.length} questions; add --questions to list them\n`));
  }
  return EXIT.ok;
}
