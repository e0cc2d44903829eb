/**
 * Pooled (Student's) two-sample t (Student 1908; Fisher 1925, Statistical Methods for Research
 * Workers, section 24).
 *
 * Two independent groups assumed to share one variance, estimated by pooling:
 *   s_p^2 = ((n1 - 1) s1^2 + (n2 - 1) s2^2) / (n1 + n2 - 2)
 *   estimate = mean(first) - mean(second),  se = s_p sqrt(1/n1 + 1/n2)
 *   t = (estimate - nullValue) / se  on  df = n1 + n2 - 2
 * p-value and interval as in t-inference.ts; effect size Hedges' g (effect-size.ts).
 * Conditions: independent units, roughly normal group means, and EQUAL SPREADS: with unequal
 * variances and unequal group sizes its error rate departs from the nominal one, which is why
 * Welch's version is the usual default.
 *
 * Worked example (NIST/SEMATECH e-Handbook of Statistical Methods, section 1.3.5.3, AUTO83B data:
 * 249 U.S. and 79 Japanese cars): means 20.14458 and 30.48101, s_p = 6.34260, t = -12.62059 on
 * 326 df.
 */
import { StatsError } from '../errors.js';
import { hedgesG } from './effect-size.js';
import { constantGroupNotes, independentCore, type IndependentCore } from './sample.js';
import { intervalNote, tInference, tResultFields } from './t-inference.js';
import type { ProcedureOptions, TestResult } from './types.js';
import { independentDetails } from './welch-t.js';

/** Pooled SD, standard error and df in scaled units. */
export function pooledSeDf(c: IndependentCore): { sp: number; se: number; df: number } {
  const { first: a, second: b } = c;
  const df = a.n + b.n - 2;
  const sp = Math.sqrt(((a.n - 1) * a.variance + (b.n - 1) * b.variance) / df);
  return { sp, se: sp * Math.sqrt(1 / a.n + 1 / b.n), df };
}

export function pooledT(first: number[], second: number[], o: ProcedureOptions): TestResult {
  if (first.length + second.length < 3 && first.length > 0 && second.length > 0) {
    throw new StatsError('too-few', 'pooled t: needs at least 3 values in all (and one in each group); with one value per group there is no spread to pool');
  }
  const c = independentCore(first, second, 'pooled t', 1, 'each group needs at least one value');
  const { sp, se, df } = pooledSeDf(c);
  const inf = tInference({ estimate: c.first.mean - c.second.mean, se, df, scale: c.scale }, o);
  // Hedges' J needs df >= 2 (J(1) = 0): with three values in all no effect size is given.
  const es = df >= 2 ? hedgesG(c.first, c.second, o.confidence, o.alternative) : null;
  return {
    procedure: 'pooled-t',
    method: 'pooled two-sample t (equal spreads assumed)',
    ...tResultFields(inf, df, o),
    estimateName: 'difference in means (first minus second)',
    n: { first: c.first.n, second: c.second.n },
    effectSize: es ? es.effect : null,
    notes: [
      'the pooled t assumes both groups share one spread (variance); if they may differ, Welch t is the safer reading',
      ...intervalNote(o.alternative),
      ...constantGroupNotes(c),
      ...(es ? es.notes : ["no Hedges' g: its small-sample correction is undefined with fewer than 2 degrees of freedom"]),
    ],
    details: { ...independentDetails(c, inf.se), sdPooled: sp / c.scale },
  };
}
