/**
 * Equivalence by two one-sided tests, TOST (Schuirmann 1987, "A comparison of the two one-sided
 * tests procedure and the power approach for assessing the equivalence of average
 * bioavailability", J. Pharmacokinetics and Biopharmaceutics 15: 657-680).
 *
 * With the equivalence range [-margin, +margin] for the true difference delta (first minus
 * second), an estimate with standard error se on df degrees of freedom, and alpha = 1 - confidence:
 *   lower test  H0: delta <= -margin  vs  delta > -margin:  t_L = (est + margin)/se,  p_L = P(T > t_L)
 *   upper test  H0: delta >= +margin  vs  delta < +margin:  t_U = (est - margin)/se,  p_U = P(T < t_U)
 * Equivalence is shown at level alpha when both are rejected, i.e. when p = max(p_L, p_U) < alpha,
 * which is the same as the (1 - 2 alpha) interval est -/+ t(1 - alpha, df) se lying inside the
 * range. So the default confidence 0.95 (alpha 0.05) gives a 90% interval; `confidence` in the
 * result is that interval's level and details.alpha the level of each one-sided test.
 * Paired: est = mean difference, se = s_d/sqrt(n), df = n - 1 (paired-t.ts).
 * Welch: est = mean(first) - mean(second), Welch se and df (welch-t.ts).
 *
 * Example (invented): differences with mean 0.3, se 0.2 on 19 df and margin 1: t_L = 6.5,
 * t_U = -3.5, p_U = 0.0012 = p, 90% interval [-0.046, 0.646] inside [-1, 1].
 */
import { StatsError } from '../errors.js';
import { dzEffect, hedgesG } from './effect-size.js';
import { tCdf, tSf } from './distributions.js';
import { pairedCore, pairedDetails } from './paired-t.js';
import { constantGroupNotes } from './sample.js';
import { boundsFromT } from './t-inference.js';
import type { EffectSize, ProcedureOptions, TestResult } from './types.js';
import { independentDetails, welchCore, welchSeDf } from './welch-t.js';

export function pairedEquivalence(first: number[], second: number[], o: ProcedureOptions): TestResult {
  const margin = checkEquivalenceOptions(o, 'paired-equivalence');
  const c = pairedCore(first, second, 'paired equivalence');
  const se = c.diff.sd / Math.sqrt(c.n);
  const level = 1 - 2 * (1 - o.confidence);
  const es = dzEffect(c.diff.mean, c.diff.sd, c.n, level, 'two-sided');
  return tostResult(
    { procedure: 'paired-equivalence', method: 'equivalence by two one-sided tests on the paired differences (paired t)', estimateName: 'mean difference (first minus second)' },
    { estimate: c.diff.mean, se, df: c.n - 1, scale: c.scale, margin, o },
    { n: { pairs: c.n }, effect: es.effect, notes: es.notes, details: pairedDetails(c, se / c.scale) },
  );
}

export function welchEquivalence(first: number[], second: number[], o: ProcedureOptions): TestResult {
  const margin = checkEquivalenceOptions(o, 'welch-equivalence');
  const c = welchCore(first, second, 'Welch equivalence');
  const { se, df } = welchSeDf(c);
  const level = 1 - 2 * (1 - o.confidence);
  const es = hedgesG(c.first, c.second, level, 'two-sided');
  return tostResult(
    { procedure: 'welch-equivalence', method: 'equivalence by two one-sided tests on the difference in means (Welch t)', estimateName: 'difference in means (first minus second)' },
    { estimate: c.first.mean - c.second.mean, se, df, scale: c.scale, margin, o },
    { n: { first: c.first.n, second: c.second.n }, effect: es.effect, notes: [...constantGroupNotes(c), ...es.notes], details: independentDetails(c, se / c.scale) },
  );
}

/** The margin is required; the alternative and null value are fixed by the TOST construction. */
function checkEquivalenceOptions(o: ProcedureOptions, id: string): number {
  if (o.margin === undefined) {
    throw new StatsError(
      'invalid-option',
      `${id} needs an equivalence margin M > 0 (option margin, --margin M): differences (first minus second) inside [-M, +M] count as practically equivalent`,
    );
  }
  if (o.alternative !== 'two-sided') {
    throw new StatsError('invalid-option', `${id} runs two one-sided tests by construction; alternative must stay two-sided, got '${o.alternative}'`);
  }
  if (o.nullValue !== 0) {
    throw new StatsError('invalid-option', `${id} tests the range [-margin, +margin] around zero; a null value does not apply (got ${o.nullValue}), leave it at 0`);
  }
  if (!(o.confidence > 0.5)) {
    throw new StatsError('invalid-option', `${id} uses a (1 - 2 alpha) interval, so confidence must be above 0.5 (e.g. 0.95 gives a 90% interval); got ${o.confidence}`);
  }
  return o.margin;
}

interface Core {
  estimate: number;
  se: number;
  df: number;
  scale: number;
  margin: number;
  o: ProcedureOptions;
}

function tostResult(
  id: Pick<TestResult, 'procedure' | 'method' | 'estimateName'>,
  c: Core,
  extra: { n: TestResult['n']; effect: EffectSize; notes: string[]; details: TestResult['details'] },
): TestResult {
  const { estimate, se, df, scale, margin, o } = c;
  const alpha = 1 - o.confidence;
  const m = margin * scale;
  const tLower = (estimate + m) / se;
  const tUpper = (estimate - m) / se;
  const pLower = tSf(tLower, df);
  const pUpper = tCdf(tUpper, df);
  const upperBinds = pUpper >= pLower;
  const level = 1 - 2 * alpha;
  const ciScaled = boundsFromT(estimate, se, df, level, 'two-sided');
  const ci: [number, number] = [ciScaled[0] / scale, ciScaled[1] / scale];
  if (![estimate / scale, ...ci].every(Number.isFinite)) {
    throw new StatsError('not-finite', 'the estimate or its interval exceeds the range of double-precision numbers (about 1.8e308); rescale the data and run again');
  }
  return {
    ...id,
    estimate: estimate / scale,
    ci,
    confidence: level,
    statistic: upperBinds ? tUpper : tLower,
    statisticName: 't',
    df,
    pValue: Math.max(pLower, pUpper),
    alternative: 'two-sided',
    nullValue: 0,
    n: extra.n,
    effectSize: extra.effect,
    notes: [
      `equivalence range [-${margin}, +${margin}]; each one-sided test at alpha = ${fmtLevel(alpha)}, so the interval is the ${fmtLevel(level * 100)}% interval; the p-value is the larger of the two one-sided p-values`,
      `the reported t is that of the ${upperBinds ? 'upper' : 'lower'} one-sided test, the one that decides`,
      ...extra.notes,
    ],
    details: {
      ...extra.details,
      margin,
      lowerMargin: -margin,
      upperMargin: margin,
      alpha,
      tLower,
      tUpper,
      pLower,
      pUpper,
      intervalInsideMargin: ci[0] > -margin && ci[1] < margin,
    },
  };
}

function fmtLevel(x: number): string {
  return String(Number(x.toPrecision(10)));
}
