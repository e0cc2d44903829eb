/**
 * Running an analysis on prepared data, as a pure function: the declared procedure, the declared
 * sensitivity analysis, the diagnostics, the flags they raise against the procedure's conditions,
 * and the words of the conclusion. The declared procedure is never swapped for another.
 *
 * A statistic that cannot be computed (all differences zero, a single pair, ...) is an explicit
 * degenerate result: `available: false` with the procedure's message and what it means.
 */
import { StatsError } from '../errors.js';
import type { PreparedData } from '../data/types.js';
import { procedureName } from '../plan/procedures.js';
import { procedureDesign, runProcedure } from '../stats/index.js';
import type { ProcedureId, ProcedureInput, TestResult } from '../stats/types.js';
import { VERSION } from '../version.js';
import { diagnosticFlags } from './analysis-checks.js';
import { agreement, estimateWords, QUICK_SCOPE, reading, type Words } from './analysis-conclusion.js';
import type { AnalysisReport, AnalysisSpec, DataInfo, DiagnosticFlag, ResultBlock } from './analysis-types.js';
import { diagnose } from './analysis-diagnose.js';

/** What each StatsError code means for the person reading the report. */
const MEANING: Record<string, string> = {
  'no-variation':
    'every value that enters the statistic is the same, so there is no spread from which to judge chance and the statistic is undefined. ' +
    'If all differences are zero, the two conditions gave identical readings on every unit: check that the two columns are not copies, and that the instrument resolves differences this small',
  'too-few': 'there are too few values for this procedure (a spread needs at least two)',
  'not-finite': 'a value is not a finite number',
  'not-binary': 'the outcome is not coded as two values',
  'invalid-option': 'an option does not fit this procedure',
  unsupported: 'this procedure cannot run on these data',
};

export function buildAnalysis(spec: AnalysisSpec, prepared: PreparedData, data: DataInfo): AnalysisReport {
  const labels = spec.labels ?? prepared.sides;
  const words: Words = { first: labels.first, second: labels.second, unit: spec.outcome.unit, event: spec.outcome.event };
  const paired = prepared.input.kind === 'paired';
  const difference =
    spec.difference ??
    (paired
      ? `each difference is ${labels.first} minus ${labels.second}; a positive difference means ${labels.first} was higher`
      : `the difference is ${labels.first} minus ${labels.second}; a positive difference means ${labels.first} was higher`);

  const main = runBlock(spec.procedure, prepared.input, spec, prepared.counts.dropped, words);
  let sensitivity: AnalysisReport['sensitivity'] = null;
  if (spec.sensitivity) {
    const input = sensitivityInput(spec.sensitivity.id, prepared.input);
    const sensSpec = isEquivalence(spec.procedure) && !isEquivalence(spec.sensitivity.id) ? byIntervalSpec(spec) : spec;
    sensitivity = { ...runBlock(spec.sensitivity.id, input, sensSpec, prepared.counts.dropped, words), why: spec.sensitivity.why };
  }

  const diag = diagnose(spec, prepared.input, labels, main, prepared.sequences);
  const flags = diagnosticFlags(spec.procedure, diag.diagnostics, paired);
  const doubts = flags.some((f) => f.severity === 'contradiction');
  const agree = agreement(main, sensitivity, doubts, words);
  const flagSummary = summarizeFlags(flags, main, sensitivity);
  const scope = spec.scope?.text ?? QUICK_SCOPE;
  const conclusion = [
    `Direction: ${difference.replace(/\.\s*$/, '')}.`,
    main.available ? `${capital(estimateWords(main, words))}.` : `The ${main.name} could not be computed: ${(main.unavailable?.message ?? '').replace(/\.?\s*$/, '.')}`,
    main.available ? `${capital(main.reading)}.` : `What this means: ${main.unavailable?.meaning}.`,
    ...(doubts ? [flagSummary!] : []),
    ...(agree ? [agree] : []),
    `What the design allows: ${scope}`,
  ].join(' ');

  return {
    format: 'tandem-analysis/1',
    tool: `tandem ${VERSION}`,
    title: spec.title,
    mode: spec.mode,
    plan: spec.planFile ?? null,
    data: { ...data, notes: prepared.notes, warnings: prepared.warnings },
    labels,
    outcome: spec.outcome,
    difference,
    main,
    sensitivity,
    diagnostics: diag.diagnostics,
    ...(diag.note ? { diagnosticsNote: diag.note } : {}),
    flags,
    flagSummary,
    agreement: agree,
    conclusion,
    scope,
    warnings: [...spec.warnings, ...prepared.warnings],
    planWarnings: spec.warnings,
    cautions: spec.cautions,
    plot: { strips: diag.strips, reference: diag.reference, legend: diag.legend },
  };
}

function isEquivalence(id: ProcedureId): boolean {
  return id === 'paired-equivalence' || id === 'welch-equivalence';
}

/**
 * A difference procedure declared as the sensitivity analysis of an equivalence test (the rule
 * base's "90% Hodges-Lehmann interval checked against the same margin") is run two-sided at the
 * equivalence test's interval level, 1 - 2 alpha, and judged by whether that interval lies inside
 * the margin: its p-value answers another question (Schuirmann 1987 on the interval form of TOST).
 */
type BlockSpec = AnalysisSpec & { intervalMargin?: boolean };

function byIntervalSpec(spec: AnalysisSpec): BlockSpec {
  const level = Math.round((1 - 2 * (1 - spec.options.confidence)) * 1e12) / 1e12;
  return { ...spec, options: { ...spec.options, alternative: 'two-sided', confidence: level, nullValue: 0 }, intervalMargin: true };
}

function runBlock(id: ProcedureId, input: ProcedureInput, spec: BlockSpec, dropped: number, words: Words): ResultBlock {
  const o = spec.options;
  const equivalence = isEquivalence(id);
  const options = { ...o, margin: equivalence ? o.margin : undefined };
  // A margin with a yes/no outcome (plan schema) is an equivalence aim judged by the interval.
  const judged = (equivalence || spec.intervalMargin || id === 'mcnemar' || id === 'two-proportions') && o.margin !== undefined;
  const base = { procedure: id, name: procedureName(id), alternative: o.alternative, nullValue: o.nullValue, ...(judged ? { margin: o.margin } : {}) };
  let r: TestResult;
  try {
    r = runProcedure(id, input, options);
  } catch (err) {
    if (!(err instanceof StatsError)) throw err;
    const block: ResultBlock = {
      ...base,
      method: procedureName(id),
      available: false,
      unavailable: { code: err.code, message: err.message, meaning: MEANING[err.code] ?? err.message },
      n: { ...inputCounts(input), dropped },
      estimate: null,
      estimateName: 'estimate',
      ci: null,
      confidence: o.confidence,
      statistic: null,
      statisticName: '',
      df: null,
      pValue: null,
      alpha: 1 - o.confidence,
      effectSize: null,
      notes: [],
      details: {},
      reading: '',
    };
    block.reading = reading(block, words);
    return block;
  }
  const alpha = typeof r.details.alpha === 'number' ? r.details.alpha : 1 - r.confidence;
  const block: ResultBlock = {
    ...base,
    method: r.method,
    ...(r.variant ? { variant: r.variant } : {}),
    available: true,
    n: { ...r.n, dropped },
    estimate: r.estimate,
    estimateName: r.estimateName,
    ci: r.ci,
    confidence: r.confidence,
    statistic: r.statistic,
    statisticName: r.statisticName,
    df: r.df,
    pValue: r.pValue,
    alternative: r.alternative,
    nullValue: r.nullValue,
    alpha,
    effectSize: r.effectSize ? { name: r.effectSize.name, formula: r.effectSize.formula, value: r.effectSize.value, ci: r.effectSize.ci } : null,
    notes: r.notes,
    details: r.details,
    reading: '',
  };
  block.reading = reading(block, words);
  return block;
}

function inputCounts(input: ProcedureInput): ResultBlock['n'] {
  if (input.kind === 'paired') return { pairs: input.first.length, dropped: 0 };
  if (input.kind === 'independent') return { first: input.first.length, second: input.second.length, dropped: 0 };
  const a = input.firstThenSecond.period1.length;
  const b = input.secondThenFirst.period1.length;
  return { pairs: a + b, first: a, second: b, dropped: 0 };
}

/**
 * The sensitivity procedure's input. A crossover's rank-based analysis compares the half period
 * differences (period 1 minus period 2, halved) between the two sequences (Koch 1972): the shift
 * between the sequences is then the effect of first minus second, as in the crossover t.
 */
function sensitivityInput(id: ProcedureId, input: ProcedureInput): ProcedureInput {
  if (input.kind !== 'crossover' || procedureDesign(id) === 'crossover') return input;
  const half = (s: { period1: number[]; period2: number[] }): number[] => s.period1.map((x, i) => (x - s.period2[i]) / 2);
  return { kind: 'independent', first: half(input.firstThenSecond), second: half(input.secondThenFirst) };
}

function summarizeFlags(flags: DiagnosticFlag[], main: ResultBlock, sens: ResultBlock | null): string | null {
  const doubts = flags.filter((f) => f.severity === 'contradiction');
  if (doubts.length === 0) return null;
  const conditions = [...new Set(doubts.map((f) => f.condition))];
  const head = `The diagnostics put ${conditions.length === 1 ? 'a condition' : 'conditions'} of the ${main.name} in doubt (${conditions.join('; ')}). The declared procedure is kept, as planned.`;
  if (!sens) return `${head} No sensitivity analysis was declared: report these diagnostics with the result rather than switching procedure after seeing the data.`;
  return `${head} The pre-declared sensitivity analysis (${sens.name}) is the check on it${sens.available ? '' : `, but it could not be computed (${sens.unavailable?.meaning})`}.`;
}

function capital(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}
