/**
 * The diagnostics of an analysis: which samples are described (the differences for paired data,
 * each group, or each sequence's half period differences for a crossover), and what the plot
 * shows for them. Describing never changes the procedure.
 */
import { StatsError } from '../errors.js';
import type { PreparedData } from '../data/types.js';
import { tQuantile } from '../stats/distributions.js';
import { describeSample } from '../stats/diagnostics.js';
import type { ProcedureInput, SampleDiagnostics } from '../stats/types.js';
import { percent } from './analysis-conclusion.js';
import type { AnalysisSpec, ResultBlock } from './analysis-types.js';
import type { Strip } from './plot.js';

export interface Diagnosed {
  diagnostics: SampleDiagnostics[];
  note?: string;
  strips: Strip[];
  reference?: { value: number; label: string };
  legend: string;
}

export function diagnose(spec: AnalysisSpec, input: ProcedureInput, labels: { first: string; second: string }, main: ResultBlock, sequences?: PreparedData['sequences']): Diagnosed {
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
