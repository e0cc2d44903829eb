/**
 * `tandem advise`: from how the data were produced to the design, the procedure and a plan.
 * Answers come from an answers file (--answers), from the interview on a terminal, or from both
 * (the interview asks only what the file leaves open). Nothing is written until every answer is
 * in; Ctrl-C (CancelledError) leaves with exit 130 and writes nothing. Files are written
 * atomically and never over an existing file without --force. The interview (and through it
 * inquirer) is imported only when a question must be asked on a terminal.
 */
import { existsSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import type { IO } from '../io.js';
import { EXIT } from '../exit-codes.js';
import { boolOpt, parseOptions, stringOpt } from '../options.js';
import { InputError, OutputError } from '../../errors.js';
import { classify, loadRuleBase, nextQuestion, type RuleBase } from '../../engine/index.js';
import type { Answers, Question, Recommendation } from '../../engine/types.js';
import { writeFileAtomic } from '../../fs/atomic.js';
import { answersSchemaRef, answersToText, parseAnswersText } from '../../interview/answers-file.js';
import { checkAnswers } from '../../interview/walk.js';
import { checkPlanObject, planFromRecommendation, slugify, writePlanText, type PlanData } from '../../plan/index.js';
import { formatProblem } from '../../problems.js';
import { renderRecommendationMarkdown, renderRecommendationText } from '../../report/recommendation.js';
import { makeStyle } from '../../report/style.js';

const HELP = `Usage: tandem advise [--answers FILE] [--plan FILE] [--save-answers FILE] [options]

Asks how your two-condition data were produced (on a terminal), or reads the answers from a file,
then says whether the design is paired, independent or outside a two-condition comparison, and
why; which procedure to run, with its conditions and a sensitivity analysis declared now; the
direction of subtraction; the hypotheses; what the conclusion may claim; and writes an analysis
plan for 'tandem analyze'.

Options:
  --answers FILE       answers file (format tandem-answers/1). On a terminal, questions the file
                       leaves open are asked; elsewhere they are listed and nothing is done.
  --plan FILE          write the analysis plan (format tandem-plan/1) to FILE
  --save-answers FILE  write the answers (format tandem-answers/1) to FILE
  --force              replace an existing FILE for --plan or --save-answers
  --title TEXT         the plan's title (default: the answers file's title, or
                       "<first> versus <second>: <outcome>")
  --json               print the result as JSON (design, procedure, conditions, difference,
                       hypotheses, scope, warnings, cautions, trace, answers, planFile)
  --markdown           print the recommendation as Markdown
  --rules DIR          use the rule base in DIR instead of the installed one (for rule authors)
  -h, --help           this text

Examples:
  tandem advise
      the interview on a terminal; at the end it offers to save the answers and the plan
  tandem advise --answers kiln-glaze.answers.yaml --plan kiln-glaze.plan.yaml
  tandem advise --answers kiln-glaze.answers.yaml --json > kiln-glaze.advice.json

Exit codes: 0 done; 2 bad input (an option, the answers file, answers missing when there is no
terminal to ask on); 3 a file not written (it exists: add --force; or the design has no plan);
130 cancelled with Ctrl-C (nothing written).
`;

const SPEC = {
  answers: { type: 'string' },
  plan: { type: 'string' },
  'save-answers': { type: 'string' },
  force: { type: 'boolean' },
  title: { type: 'string' },
  json: { type: 'boolean' },
  markdown: { type: 'boolean' },
  rules: { type: 'string' },
} as const;

interface Target {
  /** As the user typed it (for messages and next-step commands). */
  shown: string;
  abs: string;
}

interface Session {
  io: IO;
  rb: RuleBase;
  rec: Recommendation;
  title?: string;
  data?: PlanData;
  force: boolean;
}

export default async function advise(argv: string[], io: IO): Promise<number> {
  const parsed = parseOptions(argv, { ...SPEC }, 'advise');
  if (parsed.values.help) {
    io.stdout.write(HELP);
    return EXIT.ok;
  }
  if (parsed.positionals.length) throw new InputError(`advise takes no file name on its own; got '${parsed.positionals[0]}' (did you mean --answers ${parsed.positionals[0]}?)`);
  const json = boolOpt(parsed, 'json');
  const markdown = boolOpt(parsed, 'markdown');
  if (json && markdown) throw new InputError('choose one of --json and --markdown');
  const force = boolOpt(parsed, 'force');
  const target = (name: string): Target | undefined => {
    const v = stringOpt(parsed, name);
    if (v === undefined) return undefined;
    if (v.trim() === '') throw new InputError(`--${name} needs a file name`);
    return { shown: v, abs: resolve(io.cwd, v) };
  };
  const planT = target('plan');
  const saveT = target('save-answers');
  const answersT = target('answers');
  if (planT && saveT && planT.abs === saveT.abs) throw new InputError('--plan and --save-answers name the same file');
  // Refuse before asking anything: an interview that ends in "file exists" wastes the user's time.
  for (const [opt, t] of [['--plan', planT], ['--save-answers', saveT]] as const) {
    if (t && !force && existsSync(t.abs)) throw new OutputError(`${t.shown} exists; nothing was written (add --force to ${opt} to replace it)`);
  }

  const rulesOpt = stringOpt(parsed, 'rules');
  const rb = loadRuleBase(rulesOpt === undefined ? undefined : resolve(io.cwd, rulesOpt));
  const next = (a: Answers): Question | null => nextQuestion(rb, a);

  let answers: Answers = {};
  let fileTitle: string | undefined;
  let data: PlanData | undefined;
  if (answersT) {
    const read = readAnswers(answersT, rb, io);
    if (typeof read === 'number') return read;
    ({ answers, title: fileTitle } = read);
    data = read.data as PlanData | undefined;
  } else if (!io.interactive) {
    throw new InputError('no answers: run tandem advise on a terminal for the interview, or give the answers with --answers FILE (format tandem-answers/1; see tandem advise --help)');
  }

  let interviewed = false;
  const missing = checkAnswers(next, answers).missing;
  if (missing.length) {
    if (!io.interactive) throw missingError(missing, answersT?.shown);
    const { runInterview } = await import('../../interview/interview.js');
    answers = await runInterview({ next, initial: answers, io });
    interviewed = true;
  }
  const unused = checkAnswers(next, answers).unused;
  if (unused.length) io.stderr.write(`tandem advise: note: ${unused.join(', ')} ${unused.length === 1 ? 'does' : 'do'} not apply to these answers and ${unused.length === 1 ? 'was' : 'were'} not used\n`);

  const rec = classify(rb, answers);
  const s: Session = { io, rb, rec, title: stringOpt(parsed, 'title') ?? fileTitle, data, force };
  const other = rec.design.family === 'other' || rec.procedure.id === null;

  // Write what the flags ask for, then print (so the JSON can name the files written).
  let planFile: string | undefined;
  let answersFile: string | undefined;
  if (planT && !other) planFile = await writePlan(s, planT);
  if (saveT) answersFile = await writeAnswers(s, saveT);

  const shownAnswers = answersFile ?? answersT?.shown;
  if (json) io.stdout.write(JSON.stringify({ ...rec, ...(planFile ? { planFile } : {}), ...(answersFile ? { answersFile } : {}) }, null, 2) + '\n');
  else if (markdown) io.stdout.write(renderRecommendationMarkdown(rec, { planPath: planFile, answersPath: shownAnswers }));
  else io.stdout.write(renderRecommendationText(rec, makeStyle(io.color), { planPath: planFile, answersPath: shownAnswers }));
  if (planFile && !json) io.stderr.write(`tandem advise: plan written to ${planFile}\n`);
  if (answersFile && !json) io.stderr.write(`tandem advise: answers written to ${answersFile}\n`);
  if (planT && other) {
    io.stderr.write(`tandem advise: no plan written to ${planT.shown}: ${rec.design.label} is outside a two-condition comparison (see "What to do instead")\n`);
    return EXIT.output;
  }

  // On a terminal, offer to keep the answers and the plan, unless the flags already chose files.
  if (io.interactive && !json && !markdown && !planT && !saveT && (interviewed || !other)) await offerToSave(s);
  return EXIT.ok;
}

/** Reads and checks the answers file; its problems are printed with the offending line. */
function readAnswers(t: Target, rb: RuleBase, io: IO): ReturnType<typeof parseAnswersText> | number {
  let text: string;
  try {
    text = readFileSync(t.abs, 'utf8');
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    throw new InputError(`cannot read the answers file ${t.shown}: ${code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? 'it is a folder' : (err as Error).message}`);
  }
  try {
    return parseAnswersText(text, t.shown, rb);
  } catch (err) {
    if (!(err instanceof InputError) || err.problems.length === 0) throw err;
    io.stderr.write(`tandem advise: ${err.message}\n`);
    for (const p of err.problems) io.stderr.write(`  ${formatProblem(p, text).replace(/\n/g, '\n  ')}\n`);
    return EXIT.input;
  }
}

/** Builds, checks and writes the plan; a plan that would not pass `plan check` is not written. */
async function writePlan(s: Session, t: Target): Promise<string> {
  const plan = planFromRecommendation(s.rec, { title: s.title, data: s.data, created: new Date().toISOString() });
  const problems = checkPlanObject(plan);
  if (problems.length) {
    const from = s.data ? " (the data mapping comes from the answers file's data: block)" : '';
    throw new InputError(`the plan would not be valid, so ${t.shown} was not written${from}:\n  - ${problems.join('\n  - ')}`);
  }
  await writeFileAtomic(t.abs, writePlanText(plan, t.abs), { force: s.force });
  return t.shown;
}

async function writeAnswers(s: Session, t: Target): Promise<string> {
  const text = answersToText(s.rec.answers, s.rb, { title: s.title, data: s.data, schemaRef: answersSchemaRef(t.abs) });
  await writeFileAtomic(t.abs, text, { force: s.force });
  return t.shown;
}

/** The interview's last screen: offer to save the answers and the plan (Ctrl-C: nothing written). */
async function offerToSave(s: Session): Promise<void> {
  const { offerSave } = await import('../../interview/save.js');
  const a = s.rec.answers;
  const stem = `${slugify(String(a.first_label ?? ''), 'first')}-vs-${slugify(String(a.second_label ?? ''), 'second')}`.replace(/_/g, '-');
  const other = s.rec.design.family === 'other' || s.rec.procedure.id === null;
  // A design outside a two-condition comparison has no plan: offer the answers only.
  const choice = await offerSave(
    s.io,
    { answersPath: `${stem}.answers.yaml`, planPath: `${stem}.plan.yaml` },
    { force: s.force, offer: { answers: true, plan: !other } },
  );
  if (choice.answersPath) {
    await writeAnswers(s, { shown: choice.answersPath, abs: resolve(s.io.cwd, choice.answersPath) });
    s.io.stderr.write(`tandem advise: answers written to ${choice.answersPath}\n`);
  }
  if (choice.planPath && !other) {
    await writePlan(s, { shown: choice.planPath, abs: resolve(s.io.cwd, choice.planPath) });
    s.io.stderr.write(`tandem advise: plan written to ${choice.planPath}; next: tandem plan check ${choice.planPath}\n`);
  }
}

function missingError(missing: Question[], from: string | undefined): InputError {
  const lines = missing.map((q) => `  - ${q.id}: ${q.text}${q.type === 'choice' && q.choices ? ` (one of: ${q.choices.map((c) => c.value).join(', ')})` : ''}`);
  const head = from ? `${from} leaves ${missing.length === 1 ? 'a question' : 'questions'} unanswered` : 'questions are unanswered';
  return new InputError(
    `${head}, and there is no terminal to ask them on:\n${lines.join('\n')}\n` +
      'Add them under answers: in the answers file (more questions may follow, depending on these answers), or run tandem advise on a terminal.',
  );
}
