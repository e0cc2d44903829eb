/**
 * Paired t on the differences (Student 1908, "The probable error of a mean", Biometrika 6).
 *
 * Each pair gives one difference d_i = first_i - second_i; the pairs are the units, so the test is
 * a one-sample t on the differences:
 *   mean  dbar = sum(d) / n,  sd s_d (divisor n - 1),  se = s_d / sqrt(n)
 *   t = (dbar - nullValue) / se  on  df = n - 1
 * The p-value is read from the tail of the alternative (two-sided: 2 P(T > |t|)); the interval is
 * dbar -/+ t(1 - alpha/2, n - 1) se, or the one-sided bound for a one-sided alternative (the other
 * end infinite), see t-inference.ts. Effect size d_z = dbar / s_d with a noncentral t interval
 * (effect-size.ts). Conditions: the differences are independent across pairs and roughly normal
 * (or n large enough for the mean to be); the spread within each condition does not matter.
 *
 * Worked example (Student 1908, the Cushny and Peebles 1905 sleep data): second minus first
 * differences 1.2, 2.4, 1.3, 1.3, 0, 1, 1.8, 0.8, 4.6, 1.4 give dbar = 1.58, s_d = 1.2300,
 * se = 0.38896, t = 4.0621 on 9 df, two-sided p = 0.002833, 95% interval [0.7001, 2.4599].
 */
import { dzEffect } from './effect-size.js';
import { checkCount, checkFinite, checkSameLength, isRoundingLevel, maxAbs, noVariation, scaleFor, summarize, type Summary } from './sample.js';
import { intervalNote, tInference, tResultFields } from './t-inference.js';
import type { ProcedureOptions, TestResult } from './types.js';

/** The paired differences in scaled units, with their summary; shared with paired equivalence. */
export interface PairedCore {
  n: number;
  scale: number;
  diff: Summary;
  first: Summary;
  second: Summary;
}

/** Checks paired input and summarizes the differences (scaled by `scale`); throws StatsError. */
export function pairedCore(first: number[], second: number[], what: string): PairedCore {
  checkSameLength(first, second, what);
  checkFinite(first, `${what}, first condition`);
  checkFinite(second, `${what}, second condition`);
  checkCount(first.length, 2, `${what}, complete pairs`, 'a spread of the differences needs at least two pairs');
  const scale = scaleFor(first, second);
  const d = new Float64Array(first.length);
  for (let i = 0; i < d.length; i++) d[i] = first[i] * scale - second[i] * scale;
  const diff = summarize(d);
  if (diff.variance === 0 || isRoundingLevel(diff, maxAbs(first, second) * scale)) {
    throw noVariation('differences', 'difference', diff.mean / scale);
  }
  return { n: d.length, scale, diff, first: summarize(first, scale), second: summarize(second, scale) };
}

export function pairedT(first: number[], second: number[], o: ProcedureOptions): TestResult {
  const c = pairedCore(first, second, 'paired t');
  const { n, scale, diff } = c;
  const df = n - 1;
  const inf = tInference({ estimate: diff.mean, se: diff.sd / Math.sqrt(n), df, scale }, o);
  const es = dzEffect(diff.mean, diff.sd, n, o.confidence, o.alternative);
  return {
    procedure: 'paired-t',
    method: 'paired t on the differences',
    ...tResultFields(inf, df, o),
    estimateName: 'mean difference (first minus second)',
    n: { pairs: n },
    effectSize: es.effect,
    notes: [...intervalNote(o.alternative), ...es.notes],
    details: pairedDetails(c, inf.se),
  };
}

export function pairedDetails(c: PairedCore, se: number): TestResult['details'] {
  const { scale, diff, first, second } = c;
  const r = first.sd > 0 && second.sd > 0 ? (first.variance + second.variance - diff.variance) / (2 * first.sd * second.sd) : null;
  return {
    meanFirst: first.mean / scale,
    meanSecond: second.mean / scale,
    sdFirst: first.sd / scale,
    sdSecond: second.sd / scale,
    sdDifferences: diff.sd / scale,
    se,
    correlation: r === null ? null : Math.max(-1, Math.min(1, r)),
  };
}
