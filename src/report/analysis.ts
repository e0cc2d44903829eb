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
import { tQuantile } from '../stats/distributions.js';
import { describeSample } from '../stats/diagnostics.js';
import { procedureDesign, runProcedure } from '../stats/index.js';
import type { ProcedureId, ProcedureInput, SampleDiagnostics, TestResult } from '../stats/types.js';
import { VERSION } from '../version.js';
import { diagnosticFlags } from './analysis-checks.js';
import { agreement, estimateWords, percent, QUICK_SCOPE, reading, type Words } from './analysis-conclusion.js';
import type { AnalysisReport, AnalysisSpec, DataInfo, DiagnosticFlag, ResultBlock } from './analysis-types.js';
import type { Strip } from './plot.js';

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
    sensitivity = { ...runBlock(spec.sensitivity.id, input, spec, prepared.counts.dropped, words), why: spec.sensitivity.why };
  }

  const diag = diagnose(spec, prepared.input, labels, main, prepared.sequences);
  const flags = diagnosticFlags(spec.procedure, diag.diagnostics, paired);
  const doubts = flags.some((f) => f.severity === 'contradiction');
  const agree = agreement(main, sensitivity, doubts);
  const flagSummary = summarizeFlags(flags, main, sensitivity);
  const scope = spec.scope?.text ?? QUICK_SCOPE;
  const conclusion = [
    `Direction: ${difference.replace(/\.\s*$/, '')}.`,
    main.available ? `${capital(estimateWords(main, words))}.` : `The ${main.name} could not be computed: ${main.unavailable?.message}`,
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

function runBlock(id: ProcedureId, input: ProcedureInput, spec: AnalysisSpec, dropped: number, words: Words): ResultBlock {
  const o = spec.options;
  const equivalence = id === 'paired-equivalence' || id === 'welch-equivalence';
  const options = { ...o, margin: equivalence ? o.margin : undefined };
  const base = { procedure: id, name: procedureName(id), alternative: o.alternative, nullValue: o.nullValue, ...(equivalence && o.margin !== undefined ? { margin: o.margin } : {}) };
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
export function sensitivityInput(id: ProcedureId, input: ProcedureInput): ProcedureInput {
  if (input.kind !== 'crossover' || procedureDesign(id) === 'crossover') return input;
  const half = (s: { period1: number[]; period2: number[] }): number[] => s.period1.map((x, i) => (x - s.period2[i]) / 2);
  return { kind: 'independent', first: half(input.firstThenSecond), second: half(input.secondThenFirst) };
}

interface Diagnosed {
  diagnostics: SampleDiagnostics[];
  note?: string;
  strips: Strip[];
  reference?: { value: number; label: string };
  legend: string;
}

function diagnose(spec: AnalysisSpec, input: ProcedureInput, labels: { first: string; second: string }, main: ResultBlock, sequences?: PreparedData['sequences']): Diagnosed {
  const conf = percent(main.confidence);
  if (spec.outcome.binary) {
    return { diagnostics: [], note: 'shape diagnostics do not apply to a 0/1 outcome; the counts are in the result', strips: [], legend: '' };
  }
  if (input.kind === 'paired') {
    // Built from a one-double literal so V8 allocates the double store once (see data/values.ts).
    const d = [0.5];
    d.length = input.first.length;
    for (let i = 0; i < d.length; i++) d[i] = input.first[i] - input.second[i];
    const label = `differences (${labels.first} minus ${labels.second})`;
    const { list, note } = describeAll([[label, d]]);
    const ref = spec.options.nullValue;
    return {
      diagnostics: list,
      note,
      strips: [{ label: `${label}, ${d.length} pairs`, values: d, estimate: main.estimate ?? undefined, interval: main.ci }],
      reference: { value: ref, label: ref === 0 ? 'no difference' : 'null value' },
      legend: main.available ? `o ${main.estimateName}   [ ] ${conf} interval   | ${ref === 0 ? 'no difference (0)' : `null value (${ref})`}` : `| ${ref === 0 ? 'no difference (0)' : 'null value'}`,
    };
  }
  const samples: [string, number[]][] =
    input.kind === 'independent'
      ? [
          [labels.first, input.first],
          [labels.second, input.second],
        ]
      : [
          [`half period differences, sequence ${sequences?.firstThenSecond ?? 1}`, halfDiffs(input.firstThenSecond)],
          [`half period differences, sequence ${sequences?.secondThenFirst ?? 2}`, halfDiffs(input.secondThenFirst)],
        ];
  const { list, note } = describeAll(samples);
  const strips = samples.map(([label, values]): Strip => {
    const ci = meanInterval(values, main.confidence);
    return { label: `${label}, ${values.length} values`, values, ...(ci ? { estimate: ci.mean, interval: ci.interval } : {}) };
  });
  return { diagnostics: list, note, strips, legend: `o mean of each ${input.kind === 'crossover' ? 'sequence' : 'group'}   [ ] its ${conf} t interval` };
}

function describeAll(samples: [string, number[]][]): { list: SampleDiagnostics[]; note?: string } {
  const list: SampleDiagnostics[] = [];
  const notes: string[] = [];
  for (const [label, values] of samples) {
    try {
      list.push(describeSample(label, values));
    } catch (err) {
      if (!(err instanceof StatsError)) throw err;
      notes.push(`${label}: ${err.message}`);
    }
  }
  return notes.length ? { list, note: notes.join('; ') } : { list };
}

function halfDiffs(s: { period1: number[]; period2: number[] }): number[] {
  return s.period1.map((x, i) => (x - s.period2[i]) / 2);
}

/** The t interval of one sample's mean, for marking each group in the plot. */
function meanInterval(values: number[], confidence: number): { mean: number; interval: [number, number] | null } | null {
  const n = values.length;
  if (n === 0) return null;
  let mean = 0;
  for (const v of values) mean += v / n;
  if (n < 2) return { mean, interval: null };
  let ss = 0;
  for (const v of values) ss += (v - mean) * (v - mean);
  const half = tQuantile(1 - (1 - confidence) / 2, n - 1) * Math.sqrt(ss / (n - 1) / n);
  return Number.isFinite(half) ? { mean, interval: [mean - half, mean + half] } : { mean, interval: null };
}

function summarizeFlags(flags: DiagnosticFlag[], main: ResultBlock, sens: ResultBlock | null): string | null {
  const doubts = flags.filter((f) => f.severity === 'contradiction');
  if (doubts.length === 0) return null;
  const conditions = [...new Set(doubts.map((f) => f.condition))];
  const head = `The diagnostics put ${conditions.length === 1 ? 'a condition' : 'conditions'} of the ${main.name} in doubt (${conditions.join('; ')}). The declared procedure is kept, as planned.`;
  if (!sens) return `${head} No sensitivity analysis was declared: report these diagnostics with the result rather than switching procedure after seeing the data.`;
  return `${head} The pre-declared sensitivity analysis (${sens.name}) is the check on it: ${sens.available ? sens.reading : `not computed (${sens.unavailable?.meaning})`}.`;
}

function capital(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}
