/**
 * Welch two-sample t (Welch 1947, "The generalization of 'Student's' problem when several different
 * population variances are involved", Biometrika 34; Satterthwaite 1946, Biometrics Bulletin 2).
 *
 * Two independent groups; each keeps its own variance:
 *   estimate = mean(first) - mean(second),  se^2 = s1^2/n1 + s2^2/n2
 *   t = (estimate - nullValue) / se
 *   df = se^4 / ((s1^2/n1)^2/(n1 - 1) + (s2^2/n2)^2/(n2 - 1))   (Welch-Satterthwaite, fractional)
 * The p-value is read from the tail of the alternative, the interval matches it (t-inference.ts).
 * Effect size: Hedges' g with the pooled SD (effect-size.ts). Conditions: independent units,
 * each group's mean roughly normal; the spreads may differ.
 *
 * Worked example (Student 1908 sleep data read as two independent groups, as in the R
 * documentation of t.test; values from memory, matching the scipy fixtures): first
 * 0.7, -1.6, -0.2, -1.2, -0.1, 3.4, 3.7, 0.8, 0, 2; second 1.9, 0.8, 1.1, 0.1, -0.1, 4.4, 5.5, 1.6,
 * 4.6, 3.4: estimate -1.58, t = -1.8608, df = 17.776, two-sided p = 0.07939,
 * 95% interval [-3.3655, 0.2055].
 */
import { hedgesG } from './effect-size.js';
import { constantGroupNotes, independentCore, type IndependentCore } from './sample.js';
import { intervalNote, tInference, tResultFields } from './t-inference.js';
import type { ProcedureOptions, TestResult } from './types.js';

/** Welch standard error and degrees of freedom in scaled units. */
export function welchSeDf(c: IndependentCore): { se: number; df: number } {
  const a = c.first.variance / c.first.n;
  const b = c.second.variance / c.second.n;
  const se2 = a + b;
  // Each term is 0 when its group is constant; the other group then carries all the df.
  const denom = (a > 0 ? (a * a) / (c.first.n - 1) : 0) + (b > 0 ? (b * b) / (c.second.n - 1) : 0);
  return { se: Math.sqrt(se2), df: (se2 * se2) / denom };
}

export function welchCore(first: number[], second: number[], what: string): IndependentCore {
  return independentCore(first, second, what, 2, 'Welch uses the variance of each group, which needs at least two values');
}

export function welchT(first: number[], second: number[], o: ProcedureOptions): TestResult {
  const c = welchCore(first, second, 'Welch t');
  const { se, df } = welchSeDf(c);
  const inf = tInference({ estimate: c.first.mean - c.second.mean, se, df, scale: c.scale }, o);
  const es = hedgesG(c.first, c.second, o.confidence, o.alternative);
  return {
    procedure: 'welch-t',
    method: 'Welch two-sample t (Welch-Satterthwaite degrees of freedom)',
    ...tResultFields(inf, df, o),
    estimateName: 'difference in means (first minus second)',
    n: { first: c.first.n, second: c.second.n },
    effectSize: es.effect,
    notes: [
      ...intervalNote(o.alternative),
      ...constantGroupNotes(c),
      "Hedges' g standardizes by the pooled SD even though the test does not assume equal spreads; with very unequal spreads read it as a rough scale-free summary (common practice, no source)",
      ...es.notes,
    ],
    details: independentDetails(c, inf.se),
  };
}

export function independentDetails(c: IndependentCore, se: number): TestResult['details'] {
  return {
    meanFirst: c.first.mean / c.scale,
    meanSecond: c.second.mean / c.scale,
    sdFirst: c.first.sd / c.scale,
    sdSecond: c.second.sd / c.scale,
    se,
  };
}
