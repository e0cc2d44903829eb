/**
 * Difference of two independent proportions: estimate, score interval, z test and Fisher's exact
 * test.
 *
 * Estimate p1 - p2 (events / values in each group) with the Newcombe (1998a, Statistics in
 * Medicine 17:873-890) method 10 interval, built from the two Wilson score intervals
 * (binary-intervals.ts).
 * z test with the pooled proportion p = (x1 + x2) / (n1 + n2):
 *   z = (p1 - p2) / sqrt(p (1 - p) (1/n1 + 1/n2))
 * (with Yates's continuity correction 0.5 (1/n1 + 1/n2) only when the correction option is set
 * explicitly; the plain z test is the usual form). Fisher's exact test conditions on the margins
 * (binary-fisher.ts). Which p-value is primary: Fisher's when any expected cell count
 * n_i K / N or n_i (N - K) / N is below 5 (common practice, no source), else the z test; method
 * 'exact' or 'normal' forces one. Both are in details.
 * Effect size: the conditional maximum-likelihood odds ratio with the exact conditional
 * (Cornfield 1956) interval, the estimate that goes with Fisher's test. The null value must be 0.
 *
 * Worked example (Newcombe 1998a, Table II example (b), from memory): 9/10 against 3/10:
 * estimate 0.6, method 10 95% interval [0.1705, 0.8090]; expected counts 6 and 4 (< 5), so
 * Fisher's two-sided p = 0.01977 is primary; odds ratio 17.27 (conditional MLE), exact interval
 * [1.39, 1048] (scipy 1.10 agrees).
 */
import { StatsError } from '../errors.js';
import { conditionalOddsRatio, fisherPValue } from './binary-fisher.js';
import { checkBinary, countEvents } from './binary-input.js';
import { newcombeIndependent } from './binary-intervals.js';
import { normalCdf, normalQuantile, normalSf } from './distributions.js';
import { checkCount, show } from './sample.js';
import type { ProcedureOptions, TestResult } from './types.js';

export function twoProportions(first: number[], second: number[], o: ProcedureOptions): TestResult {
  checkBinary(first, 'two-proportions, first group');
  checkBinary(second, 'two-proportions, second group');
  checkCount(first.length, 1, 'two-proportions, first group', 'each group needs at least one value');
  checkCount(second.length, 1, 'two-proportions, second group', 'each group needs at least one value');
  if (o.nullValue !== 0) {
    throw new StatsError('unsupported', `two-proportions tests equal proportions (null value 0); a null value of ${show(o.nullValue)} is not supported`);
  }
  const n1 = first.length;
  const n2 = second.length;
  const x1 = countEvents(first);
  const x2 = countEvents(second);
  const N = n1 + n2;
  const K = x1 + x2;
  const p1 = x1 / n1;
  const p2 = x2 / n2;
  const minExpected = (Math.min(n1, n2) * Math.min(K, N - K)) / N;
  const zt = zTest(x1, n1, x2, n2, o);
  const fisher = fisherPValue(x1, n1, x2, n2, o.alternative);
  const fisherPrimary = o.method === 'exact' || zt === null || (o.method !== 'normal' && minExpected < 5);
  const alpha = 1 - o.confidence;
  const z = -normalQuantile(o.alternative === 'two-sided' ? alpha / 2 : alpha);
  const [lo, hi] = newcombeIndependent(x1, n1, x2, n2, z);
  // With no events (or only events) the table has no odds to compare.
  const or = K === 0 || K === N ? null : conditionalOddsRatio(x1, n1, x2, n2, o.confidence, o.alternative);
  const why =
    o.method === 'exact'
      ? 'requested'
      : zt === null
        ? 'the z test is undefined because every value in both groups is the same outcome'
        : o.method === 'normal'
          ? 'requested'
          : minExpected < 5
            ? `the smallest expected count is ${minExpected.toPrecision(3)}, below 5 (common practice, no source)`
            : `every expected count is at least 5 (smallest ${minExpected.toPrecision(3)}; common practice, no source)`;
  return {
    procedure: 'two-proportions',
    method: 'difference of two independent proportions',
    variant: fisherPrimary ? "Fisher's exact test" : `z test with pooled proportion${zt?.yates ? ' and continuity correction' : ''}`,
    estimate: p1 - p2 + 0,
    estimateName: 'difference in proportions (first minus second)',
    ci: [o.alternative === 'less' ? -1 : lo + 0, o.alternative === 'greater' ? 1 : hi + 0],
    confidence: o.confidence,
    statistic: fisherPrimary ? x1 : (zt as ZTest).z,
    statisticName: fisherPrimary ? 'x1 (events in first group)' : 'z',
    df: null,
    pValue: fisherPrimary ? fisher : (zt as ZTest).pValue,
    alternative: o.alternative,
    nullValue: 0,
    n: { first: n1, second: n2 },
    effectSize: or === null
      ? null
      : {
          name: 'odds ratio (conditional maximum likelihood)',
          formula: "odds of the event in first / odds in second, estimated given the table margins (as with Fisher's test)",
          value: or.estimate,
          ci: or.ci,
        },
    notes: [
      `events: ${x1} of ${n1} in first, ${x2} of ${n2} in second`,
      fisherPrimary
        ? `primary p-value: Fisher's exact test (${why})${o.alternative === 'two-sided' ? '; two-sided as the sum over tables no more probable than the observed' : `; one-sided, P(events in first ${o.alternative === 'greater' ? '>=' : '<='} ${x1}) given the margins`}`
        : `primary p-value: z test with pooled proportion (${why}); Fisher's exact p-value is in details`,
      `interval: Newcombe (1998a) method 10 (hybrid of two Wilson score intervals)${o.alternative === 'two-sided' ? '' : `; one-sided (${o.alternative === 'greater' ? 'upper end 1' : 'lower end -1'})`}`,
      ...(or !== null && (or.estimate === 0 || or.estimate === Infinity) ? [`the odds ratio is ${or.estimate === 0 ? '0' : 'infinite'}: a cell of the 2x2 table is empty; its interval is one-sided`] : []),
      ...(zt === null ? ['z test and odds ratio not computed: all values in both groups are the same outcome (pooled proportion 0 or 1)'] : []),
    ],
    details: {
      eventsFirst: x1,
      eventsSecond: x2,
      pFirst: p1,
      pSecond: p2,
      pooledProportion: K / N,
      minExpectedCount: minExpected,
      z: zt ? zt.z : null,
      zPValue: zt ? zt.pValue : null,
      continuityCorrection: zt ? zt.yates : null,
      fisherPValue: fisher,
    },
  };
}

interface ZTest {
  z: number;
  pValue: number;
  yates: boolean;
}

function zTest(x1: number, n1: number, x2: number, n2: number, o: ProcedureOptions): ZTest | null {
  const p = (x1 + x2) / (n1 + n2);
  const se = Math.sqrt(p * (1 - p) * (1 / n1 + 1 / n2));
  if (!(se > 0)) return null;
  const yates = o.correction === true;
  const c = yates ? 0.5 * (1 / n1 + 1 / n2) : 0;
  const d = x1 / n1 - x2 / n2;
  if (o.alternative === 'greater') {
    const z = (d - c) / se;
    return { z, pValue: normalSf(z), yates };
  }
  if (o.alternative === 'less') {
    const z = (d + c) / se;
    return { z, pValue: normalCdf(z), yates };
  }
  const z = (Math.sign(d) * Math.max(Math.abs(d) - c, 0)) / se;
  return { z, pValue: Math.min(1, 2 * normalSf(Math.abs(z))), yates };
}
