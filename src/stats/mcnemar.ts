/**
 * McNemar's test for paired binary outcomes (McNemar 1947, "Note on the sampling error of the
 * difference between correlated proportions or percentages", Psychometrika 12:153-157).
 *
 * Each pair is one unit with two 0/1 outcomes. Only discordant pairs carry information about a
 * difference: b = pairs with first 1 and second 0, c = pairs with first 0 and second 1. Under the
 * null (equal proportions) b ~ Binomial(b + c, 1/2) given b + c.
 *   exact (primary by default): greater p = P(B >= b), less p = P(B <= b),
 *     two-sided p = min(1, 2 min(P(B <= b), P(B >= b))), both tails from the incomplete beta
 *     function (distributions.ts), never by summing rounded terms;
 *   asymptotic (in details; primary with method 'normal'): X^2 = (|b - c| - 1)^2 / (b + c) with the
 *     continuity correction (none when b = c, as R), or (b - c)^2 / (b + c) without, on 1 df;
 *     one-sided: z = (b - c -/+ 1) / sqrt(b + c).
 * Estimate: p_first - p_second = (b - c) / n, interval by Newcombe (1998b) method 10
 * (binary-intervals.ts). Effect size: the paired odds ratio b / c with the transformed Wilson
 * interval (Fagerland, Lydersen and Laake 2017, ch. 8). The null value must be 0.
 *
 * Worked example (Fagerland, Lydersen and Laake 2017, ch. 8, data of Cavo et al. 2012, 161 pairs:
 * a = 59, b = 6, c = 16, d = 80): estimate -0.0621, 95% interval [-0.1186, -0.0046]; exact
 * two-sided p = 0.05248 (twice P(B <= 6) for B ~ Binomial(22, 1/2)); odds ratio 0.375
 * [0.1514, 0.9287].
 */
import { StatsError } from '../errors.js';
import { checkBinary, pairedTable } from './binary-input.js';
import { discordantRatioInterval, newcombePaired } from './binary-intervals.js';
import { binomialCdf, binomialSfInclusive, chisqSf, normalCdf, normalQuantile, normalSf } from './distributions.js';
import { checkCount, checkSameLength, show } from './sample.js';
import type { EffectSize, ProcedureOptions, TestResult } from './types.js';

export function mcnemar(first: number[], second: number[], o: ProcedureOptions): TestResult {
  checkSameLength(first, second, 'mcnemar');
  checkBinary(first, 'mcnemar, first condition');
  checkBinary(second, 'mcnemar, second condition');
  checkCount(first.length, 1, 'mcnemar, complete pairs', 'at least one pair is needed');
  if (o.nullValue !== 0) {
    throw new StatsError('unsupported', `mcnemar tests equal proportions (null value 0); a null value of ${show(o.nullValue)} is not supported`);
  }
  const t = pairedTable(first, second);
  const { a, b, c, d } = t;
  const n = first.length;
  const m = b + c;
  const lower = binomialCdf(b, m, 0.5);
  const upper = binomialSfInclusive(b, m, 0.5);
  const exactP = o.alternative === 'greater' ? upper : o.alternative === 'less' ? lower : Math.min(1, 2 * Math.min(lower, upper));
  const correction = o.correction ?? true;
  const asym = asymptotic(b, c, o.alternative, correction);
  const useAsym = o.method === 'normal' && asym !== null;
  const alpha = 1 - o.confidence;
  const z = -normalQuantile(o.alternative === 'two-sided' ? alpha / 2 : alpha);
  const [lo, hi] = newcombePaired(t, z);
  const ci: [number, number] = [o.alternative === 'less' ? -1 : lo + 0, o.alternative === 'greater' ? 1 : hi + 0];
  const cc = correction ? 'with' : 'without';
  return {
    procedure: 'mcnemar',
    method: 'McNemar test for paired binary outcomes',
    variant: useAsym ? `asymptotic (${o.alternative === 'two-sided' ? 'chi-square' : 'normal'}, ${cc} continuity correction)` : 'exact binomial test on the discordant pairs',
    estimate: (b - c) / n + 0,
    estimateName: 'difference in proportions (first minus second)',
    ci,
    confidence: o.confidence,
    statistic: useAsym && asym ? asym.statistic : b,
    statisticName: useAsym && asym ? asym.name : 'b',
    df: useAsym && asym && asym.name === 'chi-square' ? 1 : null,
    pValue: useAsym && asym ? asym.pValue : exactP,
    alternative: o.alternative,
    nullValue: 0,
    n: { pairs: n },
    effectSize: oddsRatio(b, c, z, o),
    notes: [
      `discordant pairs: b = ${b} (first 1, second 0) and c = ${c} (first 0, second 1); only these ${m} pairs carry information about a difference, the ${a + d} concordant pairs do not enter the test`,
      ...(m === 0 ? ['no discordant pairs: the data carry no information about a difference in proportions, so p = 1'] : []),
      useAsym
        ? `p-value from the asymptotic ${o.alternative === 'two-sided' ? 'chi-square' : 'normal'} approximation ${cc} continuity correction (requested); the exact p-value is ${show(exactP)}`
        : `p-value from the exact binomial distribution of b among the ${m} discordant pairs (probability 1/2 each under the null); the asymptotic chi-square p-value is in details`,
      ...(c === 0 ? [`no paired odds ratio: with c = 0 the ratio b / c is ${b === 0 ? 'undefined' : 'infinite'}`] : []),
      `interval: Newcombe (1998b) method 10, Wilson score limits with a correction for the pairing${o.alternative === 'two-sided' ? '' : `; one-sided (${o.alternative === 'greater' ? 'upper end 1' : 'lower end -1'})`}`,
    ],
    details: {
      a,
      b,
      c,
      d,
      discordant: m,
      pFirst: (a + b) / n,
      pSecond: (a + c) / n,
      exactPValue: exactP,
      chiSquare: asym ? asym.chiSquare : null,
      chiSquarePValue: asym ? asym.chiSquarePValue : null,
      asymptoticZ: asym ? asym.z : null,
      asymptoticPValue: asym ? asym.pValue : null,
      continuityCorrection: correction,
    },
  };
}

interface Asymptotic {
  statistic: number;
  name: string;
  pValue: number;
  chiSquare: number;
  chiSquarePValue: number;
  z: number;
}

function asymptotic(b: number, c: number, alternative: ProcedureOptions['alternative'], correction: boolean): Asymptotic | null {
  const m = b + c;
  if (m === 0) return null;
  const cc = correction && b !== c ? 1 : 0;
  const chiSquare = Math.max(Math.abs(b - c) - cc, 0) ** 2 / m;
  const chiSquarePValue = chisqSf(chiSquare, 1);
  const oneSidedCc = correction ? 1 : 0;
  if (alternative === 'greater') {
    const z = (b - c - oneSidedCc) / Math.sqrt(m);
    return { statistic: z, name: 'z', pValue: normalSf(z), chiSquare, chiSquarePValue, z };
  }
  if (alternative === 'less') {
    const z = (b - c + oneSidedCc) / Math.sqrt(m);
    return { statistic: z, name: 'z', pValue: normalCdf(z), chiSquare, chiSquarePValue, z };
  }
  const z = (Math.sign(b - c) * Math.max(Math.abs(b - c) - cc, 0)) / Math.sqrt(m);
  return { statistic: chiSquare, name: 'chi-square', pValue: chiSquarePValue, chiSquare, chiSquarePValue, z };
}

function oddsRatio(b: number, c: number, z: number, o: ProcedureOptions): EffectSize | null {
  if (c === 0) return null;
  const [lo, hi] = discordantRatioInterval(b, c, z);
  return {
    name: 'paired odds ratio',
    formula: 'b / c (discordant pairs favouring first over those favouring second)',
    value: b / c,
    ci: [o.alternative === 'less' ? 0 : lo, o.alternative === 'greater' ? Infinity : hi],
  };
}
