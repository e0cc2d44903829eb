/**
 * Wilcoxon-Mann-Whitney rank-sum test for two independent groups, with the Hodges-Lehmann shift
 * and the probability of superiority (Wilcoxon 1945; Mann and Whitney 1947, Annals of
 * Mathematical Statistics 18:50-60; Hodges and Lehmann 1963; Hollander and Wolfe 1999, ch. 4).
 *
 * What it tests: whether a value from the first group tends to exceed one from the second
 * (stochastic superiority), not whether the medians differ; it reads as a shift in location only
 * when both groups have the same shape.
 *
 * Test: rank all N = n1 + n2 values (first shifted by -nullValue) together, midranks for ties;
 * U = R1 - n1(n1+1)/2 (R1 = rank sum of the first group) = #{x_i > y_j} + 0.5 #{x_i = y_j}.
 * Under the null U has mean n1 n2 / 2 and variance
 *   n1 n2 / 12 * ((N + 1) - sum(t^3 - t) / (N (N - 1))).
 * Exact distribution (rank-exact.ts) when both groups have fewer than 50 values and there are no
 * ties (as R; method 'exact' allows larger groups up to a work limit), else the normal
 * approximation with the tie term and, by default, a continuity correction of 0.5.
 *
 * Estimate: the median of the n1 n2 differences first_i - second_j (Hodges-Lehmann shift), found
 * without listing them (rank-select.ts), with the interval from the U distribution
 * (rank-inference.ts). Effect size: the probability of superiority
 *   PS = P(X > Y) + 0.5 P(X = Y) = U / (n1 n2)   (on the data as observed, no shift)
 * with the score-type interval of Newcombe (2006, "Confidence intervals for an effect size measure
 * based on the Mann-Whitney statistic. Part 2", Statistics in Medicine 25:559-573, method 5), see
 * rank-superiority.ts.
 *
 * Worked example (invented: drying times of a glaze in two kilns, minutes): first 41, 44, 47, 52,
 * second 38, 40, 43 give U = 11, exact two-sided p = 0.1143 (twice 2 of 35 arrangements), Hodges-
 * Lehmann shift 5, interval [-2, 14] (the widest possible: 94.3% is the most 4 and 3 values allow),
 * PS = 11/12 = 0.917.
 */
import { StatsError } from '../errors.js';
import { exactIntervalRanks, exactPValue, hodgesLehmann, normalIntervalRanks, normalPValue, pct, type IntervalRanks, type RankTestPart } from './rank-inference.js';
import { RANK_SUM_EXACT_MAX_COST, rankSumCost, rankSumCounts, tailsOf } from './rank-exact.js';
import { MatrixSelector, shiftMatrix } from './rank-select.js';
import { superiorityInterval } from './rank-superiority.js';
import { countSuperiority, roundingTolerance, scaledCopy, shiftedCopy, twoSampleSweep, type TwoSampleRankSummary } from './rank-ties.js';
import { checkCount, checkFinite, maxAbs, scaleFor, show } from './sample.js';
import type { ProcedureOptions, TestResult } from './types.js';

const AUTO_EXACT_BELOW = 50;

export function rankSum(first: number[], second: number[], o: ProcedureOptions): TestResult {
  checkFinite(first, 'rank-sum, first group');
  checkFinite(second, 'rank-sum, second group');
  checkCount(first.length, 1, 'rank-sum, first group', 'each group needs at least one value');
  checkCount(second.length, 1, 'rank-sum, second group', 'each group needs at least one value');
  const n1 = first.length;
  const n2 = second.length;
  const N = n1 + n2;
  const f = scaleFor(first, second, [o.nullValue]);
  const x = scaledCopy(first, f).sort();
  const y = scaledCopy(second, f).sort();
  const mu = o.nullValue * f;
  const xs = mu === 0 ? x : shiftedCopy(x, mu);
  // Only a shift by the null value does arithmetic; without it, equality is exact.
  const tol = mu === 0 ? 0 : roundingTolerance(Math.max(maxAbs(x) + Math.abs(mu), maxAbs(y)));
  const s = twoSampleSweep(xs, y, tol);
  if (s.tieTerm === N * N * N - N) {
    throw new StatsError(
      'no-variation',
      `all ${N} values of both groups are equal${mu === 0 ? '' : ' after shifting the first group by the null value'}: the ranks carry no information, so the rank-sum test is undefined; the data show no difference between the groups at all`,
    );
  }
  const U = s.rankSumFirst - (n1 * (n1 + 1)) / 2;
  const size = n1 * n2;
  const test = testPart(s, U, n1, n2, o);
  const sel = new MatrixSelector(shiftMatrix(x, y));
  const ciExact = o.method !== 'normal' && exactAllowed(n1, n2, o);
  const ranks: IntervalRanks = ciExact
    ? exactIntervalRanks(rankSumCounts(n1, n2), size, o.confidence, o.alternative)
    : normalIntervalRanks(size, Math.sqrt((size * (N + 1)) / 12), o.confidence, o.alternative);
  const { estimate, ci } = hodgesLehmann(sel, ranks, f, o.alternative);
  const ps = countSuperiority(x, y) / size;
  const psCi = superiorityInterval(ps, n1, n2, o.confidence, o.alternative);
  return {
    procedure: 'rank-sum',
    method: 'Wilcoxon-Mann-Whitney rank-sum test',
    variant: test.variant,
    estimate,
    estimateName: 'Hodges-Lehmann shift (median of all differences first minus second)',
    ci,
    confidence: o.confidence,
    statistic: U,
    statisticName: 'U',
    df: null,
    pValue: test.pValue,
    alternative: o.alternative,
    nullValue: o.nullValue,
    n: { first: n1, second: n2, ties: s.tiedGroups },
    effectSize: {
      name: 'probability of superiority',
      formula: 'P(first > second) + 0.5 P(first = second) = U / (n1 n2), on the data as observed',
      value: ps,
      ci: psCi,
    },
    notes: [
      'the rank-sum test compares whole distributions: it asks whether a value from the first group tends to exceed one from the second (stochastic superiority), not whether the medians differ; the Hodges-Lehmann shift describes a location difference only when both groups have the same shape',
      test.note,
      intervalNote(ranks, size, ciExact, o, s.tiedGroups > 0),
      'probability-of-superiority interval: Newcombe (2006) method 5 (score type); it assumes no ties',
      ...(s.nearTies > 0 ? [`${s.nearTies} value(s) differed from a tied value only by floating-point rounding and were treated as equal`] : []),
    ],
    details: {
      uSecond: size - U,
      rankSumFirst: s.rankSumFirst,
      meanU: size / 2,
      sdU: test.sd,
      z: test.z,
      continuityCorrection: test.correction,
      ciMethod: ciExact ? 'exact' : 'normal',
      ciLowerRank: ranks.lower,
      ciUpperRank: ranks.upper,
      pairwiseDifferences: size,
      achievedConfidence: ranks.achieved,
    },
  };
}

function exactAllowed(n1: number, n2: number, o: ProcedureOptions): boolean {
  if (o.method === 'exact') return rankSumCost(n1, n2) <= RANK_SUM_EXACT_MAX_COST;
  return n1 < AUTO_EXACT_BELOW && n2 < AUTO_EXACT_BELOW;
}

function testPart(s: TwoSampleRankSummary, U: number, n1: number, n2: number, o: ProcedureOptions): RankTestPart {
  const ties = s.tiedGroups > 0;
  if (o.method !== 'normal' && !ties && exactAllowed(n1, n2, o)) {
    return {
      pValue: exactPValue(tailsOf(rankSumCounts(n1, n2), U), o.alternative),
      variant: 'exact null distribution of U',
      note: `p-value from the exact null distribution of U for groups of ${n1} and ${n2} without ties`,
      z: null,
      sd: null,
      correction: null,
    };
  }
  const N = n1 + n2;
  const correction = o.correction ?? true;
  const sd = Math.sqrt(((n1 * n2) / 12) * (N + 1 - s.tieTerm / (N * (N - 1))));
  const { z, pValue } = normalPValue(U, (n1 * n2) / 2, sd, o.alternative, correction);
  const why = ties
    ? `the exact distribution assumes no ties; here ${s.tiedGroups} tied group(s)`
    : o.method === 'normal'
      ? 'normal approximation requested'
      : o.method === 'exact'
        ? 'exact p-value requested, but the groups are too large for the exact distribution'
        : `the exact distribution is used while both groups have fewer than ${AUTO_EXACT_BELOW} values`;
  return {
    pValue,
    variant: `normal approximation${ties ? ' with tie correction' : ''}${correction ? ' and continuity correction' : ''}`,
    note: `p-value from the normal approximation to U (mean ${show((n1 * n2) / 2)}, SD ${show(Number(sd.toPrecision(6)))}${ties ? ', tie-corrected' : ''}), ${correction ? 'with' : 'without'} continuity correction (${why})`,
    z,
    sd,
    correction,
  };
}

function intervalNote(r: IntervalRanks, size: number, exact: boolean, o: ProcedureOptions, ties: boolean): string {
  const which = [r.lower, r.upper].filter((x) => x !== null).join(' and ');
  const side = o.alternative === 'greater' ? '; one-sided (upper end +Infinity)' : o.alternative === 'less' ? '; one-sided (lower end -Infinity)' : '';
  const base = `interval: pairwise differences ${which} of ${size} in order, critical value from the ${exact ? 'exact' : 'normal approximation to the'} U distribution; achieved confidence ${pct(r.achieved)}${side}`;
  const caveat = exact && ties ? '; with tied values the achieved confidence is approximate (usually a little higher)' : '';
  return r.short ? `${base}${caveat}; groups too small to reach ${pct(o.confidence)}: this is the widest interval the data allow` : base + caveat;
}
