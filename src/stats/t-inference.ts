/**
 * The inference step every t procedure shares: from an estimate, its standard error and the
 * degrees of freedom to the t statistic, the p-value of the stated alternative and the matching
 * confidence interval.
 *
 *   t = (estimate - nullValue) / se
 *   two-sided: p = 2 P(T > |t|),  interval estimate -/+ t(1 - alpha/2, df) se
 *   greater:   p = P(T > t),      interval [estimate - t(1 - alpha, df) se, +Infinity)
 *   less:      p = P(T < t),      interval (-Infinity, estimate + t(1 - alpha, df) se]
 * with alpha = 1 - confidence. One-sided alternatives get the one-sided confidence bound whose
 * other end is infinite (the interval that corresponds to the one-sided test, as scipy reports).
 *
 * Each p-value is read from the tail it needs (tSf / tCdf in distributions.ts), never as 1 - F,
 * so 1e-12 keeps its digits; the critical value is taken from the small tail probability (alpha/2
 * rather than 1 - alpha/2) for the same reason.
 *
 * Example: estimate 1.58, se 0.3890 on 9 df, two-sided 95%: t = 4.062, p = 0.002833,
 * interval [0.700, 2.460] (Student 1908 sleep data, first minus second reversed).
 */
import { StatsError } from '../errors.js';
import { tCdf, tQuantile, tSf } from './distributions.js';
import type { Alternative, ProcedureOptions, TestResult } from './types.js';

export interface TInference {
  estimate: number;
  se: number;
  statistic: number;
  pValue: number;
  ci: [number, number];
}

/** p-value of t on df degrees of freedom for the alternative, each from its own tail. */
export function tPValue(t: number, df: number, alternative: Alternative): number {
  if (alternative === 'greater') return tSf(t, df);
  if (alternative === 'less') return tCdf(t, df);
  return Math.min(1, 2 * tSf(Math.abs(t), df));
}

/** The critical value t(1 - p, df) for a small upper-tail probability p, computed from the lower tail. */
export function tCritical(p: number, df: number): number {
  return -tQuantile(p, df);
}

/** Interval for the estimate matching the alternative (two-sided, or a one-sided bound). */
export function boundsFromT(estimate: number, se: number, df: number, confidence: number, alternative: Alternative): [number, number] {
  const alpha = 1 - confidence;
  if (alternative === 'greater') return [estimate - tCritical(alpha, df) * se, Infinity];
  if (alternative === 'less') return [-Infinity, estimate + tCritical(alpha, df) * se];
  const q = tCritical(alpha / 2, df);
  return [estimate - q * se, estimate + q * se];
}

/**
 * Statistic, p-value and interval from an estimate and its standard error given in scaled units
 * (multiplied by the power of two `scale`, see sample.ts); the results come back in the data's units.
 */
export function tInference(
  scaled: { estimate: number; se: number; df: number; scale: number },
  o: Pick<ProcedureOptions, 'alternative' | 'confidence' | 'nullValue'>,
): TInference {
  const { estimate, se, df, scale } = scaled;
  const statistic = (estimate - o.nullValue * scale) / se;
  const pValue = tPValue(statistic, df, o.alternative);
  const ciScaled = boundsFromT(estimate, se, df, o.confidence, o.alternative);
  const result: TInference = {
    estimate: estimate / scale,
    se: se / scale,
    statistic,
    pValue,
    ci: [ciScaled[0] / scale, ciScaled[1] / scale],
  };
  assertRepresentable(result, o.alternative);
  return result;
}

/** The data are finite, but an estimate or interval end beyond about 1.8e308 cannot be reported. */
function assertRepresentable(r: TInference, alternative: Alternative): void {
  const ends = [alternative === 'less' ? 0 : r.ci[0], alternative === 'greater' ? 0 : r.ci[1]];
  if (![r.estimate, r.se, ...ends].every(Number.isFinite) || Number.isNaN(r.pValue) || Number.isNaN(r.statistic)) {
    throw new StatsError(
      'not-finite',
      'the estimate or its interval exceeds the range of double-precision numbers (about 1.8e308); rescale the data (e.g. change the unit) and run again',
    );
  }
}

/** One-sided alternatives report a one-sided confidence bound; say so. */
export function intervalNote(alternative: Alternative): string[] {
  if (alternative === 'greater') return ['one-sided alternative (greater): the interval is a lower confidence bound; its upper end is +Infinity'];
  if (alternative === 'less') return ['one-sided alternative (less): the interval is an upper confidence bound; its lower end is -Infinity'];
  return [];
}

/** The fields every t-based TestResult shares, from its inference, its df and the options. */
export function tResultFields(
  inf: TInference,
  df: number,
  o: ProcedureOptions,
): Pick<TestResult, 'estimate' | 'ci' | 'confidence' | 'statistic' | 'statisticName' | 'df' | 'pValue' | 'alternative' | 'nullValue'> {
  return {
    estimate: inf.estimate,
    ci: inf.ci,
    confidence: o.confidence,
    statistic: inf.statistic,
    statisticName: 't',
    df,
    pValue: inf.pValue,
    alternative: o.alternative,
    nullValue: o.nullValue,
  };
}
