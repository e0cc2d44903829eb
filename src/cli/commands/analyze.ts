/**
 * `tandem analyze`: run an analysis plan (or, in quick mode, a named procedure) on a CSV file.
 * Reads only the columns it needs, forms pairs or groups as the layout says, runs the declared
 * procedure and the declared sensitivity analysis, describes the data, and reports as text,
 * Markdown (`--report`) or JSON (`--json`). It never switches procedure after seeing the data.
 */
import { existsSync } from 'node:fs';
import { basename, resolve } from 'node:path';
import type { IO } from '../io.js';
import { EXIT } from '../exit-codes.js';
import { boolOpt, choiceOpt, numberOpt, parseOptions, stringOpt, type OptionSpec, type Parsed } from '../options.js';
import { InputError, OutputError } from '../../errors.js';
import { DEFAULT_MISSING } from '../../data/cells.js';
import { parseDelimiterOption, type DelimiterChoice } from '../../data/delimiter.js';
import { quickLayout } from '../../data/quick-layout.js';
import type { LayoutSpec, PreparedData } from '../../data/types.js';
import { PROCEDURES, procedureName, sensitivityAllowed } from '../../plan/procedures.js';
import type { AnalysisSpec, DataInfo } from '../../report/analysis-types.js';
import { PROCEDURE_IDS, type ProcedureId, type ProcedureInput } from '../../stats/types.js';

const COLUMN_OPTIONS = ['first', 'second', 'id', 'group', 'value', 'condition', 'first-level', 'second-level', 'sequence', 'period1', 'period2', 'first-then-second', 'second-then-first'];
const QUICK_ONLY = ['procedure', 'alternative', 'confidence', 'null', 'margin', 'sensitivity', 'event', 'unit', 'pair-by-row-order', ...COLUMN_OPTIONS];

const SPEC: OptionSpec = {
  data: { type: 'string' },
  procedure: { type: 'string' },
  ...Object.fromEntries(COLUMN_OPTIONS.map((k) => [k, { type: 'string' as const }])),
  'pair-by-row-order': { type: 'boolean' },
  alternative: { type: 'string' },
  confidence: { type: 'string' },
  null: { type: 'string' },
  margin: { type: 'string' },
  sensitivity: { type: 'string' },
  event: { type: 'string' },
  unit: { type: 'string' },
  missing: { type: 'string' },
  delimiter: { type: 'string' },
  json: { type: 'boolean' },
  report: { type: 'string' },
  force: { type: 'boolean' },
};

export const HELP = `Usage:
  tandem analyze PLAN --data FILE [--report FILE.md] [--json]
  tandem analyze --data FILE --procedure ID <columns> [options]

Runs the plan's declared procedure and its declared sensitivity analysis on a CSV file, checks
the data against the procedure's conditions, and reports the estimate (first minus second), its
interval, the test, an effect size and a conclusion in words. The procedure is never switched
after seeing the data: doubtful conditions are reported beside the sensitivity result.

Quick mode (no plan) names the procedure and the columns:
  paired, one row per unit         --first A --second B  and  --id ID  or  --pair-by-row-order
  paired, one row per measurement  --id ID --condition C --value V [--first-level X --second-level Y]
  independent, group column        --group G --value V [--first-level X --second-level Y] [--id ID]
  independent, a column per group  --first A --second B   (columns may differ in length)
  2x2 crossover                    --sequence S --period1 P1 --period2 P2 --first-then-second X
Unnamed levels default to the two values of the column in order of appearance (stated in the report).

Options:
  --data FILE            the CSV file (header row; comma, semicolon or tab; UTF-8)
  --procedure ID         ${PROCEDURE_IDS.join(', ')}
  --alternative SIDE     two-sided (default), greater or less, for first minus second
  --confidence LEVEL     interval level in (0, 1), default 0.95 (equivalence: 0.90, each
                         one-sided test at half of 1 - LEVEL)
  --null VALUE           difference under the null hypothesis, default 0
  --margin M             equivalence margin (paired-equivalence, welch-equivalence)
  --sensitivity ID       a sensitivity analysis to run beside the procedure (quick mode)
  --event VALUE          binary outcomes: the value that counts as the event (0/1, yes/no, true/false known)
  --unit TEXT            the outcome's unit, for the report (e.g. "mm")
  --missing LIST         missing markers, comma-separated (default: NA); an empty cell is always missing
  --delimiter D          comma, semicolon, tab or auto (default: from the header line)
  --json                 JSON on standard output instead of text (format tandem-analysis/1)
  --report FILE.md       also write the report as Markdown
  --force                replace an existing report file
  -h, --help             this help

Exit codes: 0 analysed; 2 bad input, or the declared procedure cannot be computed from these data
(the report says why); 3 the report file exists (use --force) or cannot be written.
`;

export default async function analyze(argv: string[], io: IO): Promise<number> {
  const p = parseOptions(argv, SPEC, 'analyze');
  if (boolOpt(p, 'help')) {
    io.stdout.write(HELP);
    return EXIT.ok;
  }
  const dataArg = stringOpt(p, 'data');
  if (dataArg === undefined) throw new InputError("--data FILE is required (the CSV file to analyse); see 'tandem analyze --help'");
  if (p.positionals.length > 1) throw new InputError(`analyze takes one plan file; got ${p.positionals.length}: ${p.positionals.join(', ')}`);
  const reportArg = stringOpt(p, 'report');
  const force = boolOpt(p, 'force');
  const reportPath = reportArg === undefined ? undefined : resolve(io.cwd, reportArg);
  if (reportPath && !force && existsSync(reportPath)) throw new OutputError(`${reportArg} exists; nothing was analysed or written (use --force to replace it)`);

  const job = p.positionals.length === 1 ? await fromPlan(p, resolve(io.cwd, p.positionals[0]), p.positionals[0]) : fromQuick(p, dataArg);
  const missingArg = stringOpt(p, 'missing');
  const delimiterArg = stringOpt(p, 'delimiter');
  const missing = missingArg !== undefined ? ['', ...missingArg.split(',').map((m) => m.trim())] : job.missing ?? [...DEFAULT_MISSING];
  const delimiter: DelimiterChoice = delimiterArg !== undefined ? parseDelimiterOption(delimiterArg) : job.delimiter ?? 'auto';

  const spec = job.spec;
  // The reading, statistics and report modules load only now: --help and option errors stay fast.
  const [{ checkLayout }, { buildAnalysis }, { analysisJson }, { analysisMarkdown }, { analysisText }, { makeStyle }, { writeFileAtomic }] = await Promise.all([
    import('../../data/prepare.js'),
    import('../../report/analysis.js'),
    import('../../report/analysis-json.js'),
    import('../../report/analysis-markdown.js'),
    import('../../report/analysis-text.js'),
    import('../../report/style.js'),
    import('../../fs/atomic.js'),
  ]);
  checkLayout(designOf(spec.procedure), job.layout.layout, spec.procedure);
  const { prepared, info } = await load(resolve(io.cwd, dataArg), dataArg, job.layout, { binary: spec.outcome.binary, event: spec.outcome.event }, delimiter, missing);
  const report = buildAnalysis(spec, prepared, info);

  io.stdout.write(boolOpt(p, 'json') ? analysisJson(report) : analysisText(report, makeStyle(io.color)));
  if (reportPath) {
    await writeFileAtomic(reportPath, analysisMarkdown(report), { force });
    io.stderr.write(`tandem analyze: Markdown report written to ${reportArg}\n`);
  }
  if (!report.main.available) {
    const u = report.main.unavailable!;
    io.stderr.write(`tandem analyze: the ${report.main.name} cannot be computed from these data (${u.code}): ${u.message}\n`);
    return EXIT.input;
  }
  return EXIT.ok;
}

/**
 * The procedures' confidence option from the interval level the user gives. A plan's
 * procedure.confidence and --confidence are the interval's level (plan schema); the two
 * one-sided tests of an equivalence procedure take 1 - alpha and report the 1 - 2 alpha interval
 * (Schuirmann 1987), so an interval level of 0.90 means each test at 5%: 1 - (1 - 0.90) / 2.
 */
function testConfidence(id: ProcedureId, intervalLevel: number): number {
  if (!PROCEDURES[id].equivalence) return intervalLevel;
  return Math.round((1 - (1 - intervalLevel) / 2) * 1e12) / 1e12;
}

/** The kind of input a procedure reads (the same as the stats registry's, without loading it). */
function designOf(id: ProcedureId): ProcedureInput['kind'] {
  return id === 'crossover-t' ? 'crossover' : PROCEDURES[id].family;
}

/**
 * Reads and prepares the data. The table (every requested column, codes and line numbers) is
 * dropped on return, so only the prepared arrays stay in memory during the analysis.
 */
async function load(path: string, file: string, layout: LayoutSpec, outcome: { binary: boolean; event?: string }, delimiter: DelimiterChoice, missing: string[]): Promise<{ prepared: PreparedData; info: DataInfo }> {
  const [{ readTable }, { columnRequests, prepare }, { DELIMITER_NAMES }] = await Promise.all([import('../../data/read.js'), import('../../data/prepare.js'), import('../../data/delimiter.js')]);
  const table = readTable(path, columnRequests(layout, outcome), { delimiter, missing }, file);
  const prepared = prepare(table, layout, outcome);
  const info: DataInfo = {
    file,
    layout: layout.layout,
    parser: table.parser,
    delimiter: DELIMITER_NAMES[table.delimiter],
    rows: table.rows,
    missingMarkers: [...new Set(missing)],
  };
  return { prepared, info };
}

interface Job {
  spec: AnalysisSpec;
  layout: LayoutSpec;
  missing?: string[];
  delimiter?: DelimiterChoice;
}

async function fromPlan(p: Parsed, path: string, shown: string): Promise<Job> {
  const misplaced = QUICK_ONLY.filter((k) => p.values[k] !== undefined);
  if (misplaced.length) {
    throw new InputError(
      `${misplaced.map((k) => `--${k}`).join(', ')} cannot be combined with a plan: the plan fixes the procedure, its options and the columns ` +
        `(edit the plan and record why, or drop the plan for quick mode)`,
    );
  }
  // Loaded here, not at the top: the plan reader brings the JSON Schema validator, which quick
  // mode does not need.
  const { readPlan } = await import('../../plan/read.js');
  const plan = await readPlan(path);
  const { missing, delimiter, ...layout } = plan.data;
  const id = plan.procedure.id;
  const spec: AnalysisSpec = {
    mode: 'plan',
    planFile: shown,
    title: plan.title,
    procedure: id,
    options: {
      alternative: plan.procedure.alternative,
      confidence: testConfidence(id, plan.procedure.confidence),
      nullValue: plan.procedure.nullValue,
      ...(plan.procedure.margin !== undefined ? { margin: plan.procedure.margin } : {}),
    },
    sensitivity: plan.sensitivity,
    labels: { first: plan.study.first, second: plan.study.second },
    outcome: { name: plan.study.outcome, unit: plan.study.outcomeUnit, binary: PROCEDURES[id].binary, event: plan.study.event },
    unitName: plan.study.unit,
    difference: plan.difference,
    scope: plan.scope,
    conditions: plan.conditions,
    warnings: plan.warnings,
    cautions: plan.cautions,
  };
  return { spec, layout: layout as LayoutSpec, missing: missing ? ['', ...missing] : undefined, delimiter };
}

function fromQuick(p: Parsed, dataArg: string): Job {
  const id = choiceOpt(p, 'procedure', PROCEDURE_IDS);
  if (id === undefined) throw new InputError(`quick mode needs --procedure ID (one of ${PROCEDURE_IDS.join(', ')}), or give a plan file`);
  const alternative = choiceOpt(p, 'alternative', ['two-sided', 'greater', 'less'] as const) ?? 'two-sided';
  const facts = PROCEDURES[id];
  const level = numberOpt(p, 'confidence', { min: 0, max: 1, openMin: true, openMax: true }) ?? (facts.equivalence ? 0.9 : 0.95);
  const confidence = testConfidence(id, level);
  const nullValue = numberOpt(p, 'null') ?? 0;
  const margin = numberOpt(p, 'margin', { min: 0, openMin: true });
  if (facts.equivalence && margin === undefined) {
    throw new InputError(`${id} needs --margin M: differences (first minus second) within -M to +M count as practically equivalent; choose M before looking at the data`);
  }
  if (!facts.equivalence && margin !== undefined) throw new InputError(`--margin is for the equivalence procedures (paired-equivalence, welch-equivalence), not ${id}`);
  const sensRaw = choiceOpt(p, 'sensitivity', PROCEDURE_IDS);
  if (sensRaw !== undefined && !sensitivityAllowed(id).includes(sensRaw)) {
    throw new InputError(`--sensitivity ${sensRaw} does not fit ${id}; allowed: ${sensitivityAllowed(id).join(', ') || 'none'}`);
  }
  const event = stringOpt(p, 'event');
  if (event !== undefined && !facts.binary) throw new InputError(`--event is for binary outcomes (mcnemar, two-proportions), not ${id}`);
  const s = (k: string): string | undefined => stringOpt(p, k);
  const layout = quickLayout(designOf(id), id, {
    first: s('first'), second: s('second'), id: s('id'), group: s('group'), value: s('value'), condition: s('condition'),
    firstLevel: s('first-level'), secondLevel: s('second-level'), sequence: s('sequence'), period1: s('period1'), period2: s('period2'),
    firstThenSecond: s('first-then-second'), secondThenFirst: s('second-then-first'), pairByRowOrder: boolOpt(p, 'pair-by-row-order') || undefined,
  });
  const sensitivity: ProcedureId | undefined = sensRaw;
  const spec: AnalysisSpec = {
    mode: 'quick',
    title: `${procedureName(id)}: ${basename(dataArg)}`,
    procedure: id,
    options: { alternative, confidence, nullValue, ...(margin !== undefined ? { margin } : {}) },
    sensitivity: sensitivity ? { id: sensitivity, why: 'named with --sensitivity' } : null,
    outcome: { unit: s('unit'), binary: facts.binary, event },
    conditions: [],
    warnings: [],
    cautions: [
      "tandem does not replace a qualified statistician, an ethics review or a protocol's pre-specified analysis plan; where these apply, they come first.",
    ],
  };
  return { spec, layout };
}
