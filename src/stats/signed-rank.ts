/**
 * Wilcoxon signed-rank test on paired differences, with the Hodges-Lehmann estimate and interval
 * (Wilcoxon 1945, Biometrics Bulletin 1:80-83; Hodges and Lehmann 1963, Annals of Mathematical
 * Statistics 34:598-611; Hollander and Wolfe 1999, "Nonparametric Statistical Methods", ch. 3).
 *
 * Test: d_i = first_i - second_i - nullValue. Zeros (d_i = 0, to rounding) are dropped before
 * ranking (Wilcoxon's zero handling, the default of R and scipy); the n' remaining |d_i| are
 * ranked (midranks for ties) and W+ is the sum of the ranks of the positive d_i. Under the null
 * (differences symmetric about nullValue) W+ has mean n'(n'+1)/4 and variance
 *   n'(n'+1)(2n'+1)/24 - sum(t^3 - t)/48   (t = sizes of tied groups).
 * The p-value comes from the exact distribution (rank-exact.ts) when n' <= 50 and there are no
 * ties and no zeros (method 'exact' raises the limit to 500), otherwise from the normal
 * approximation with the tie term and, by default, a continuity correction of 0.5
 * (rank-inference.ts). Pratt's (1959) alternative, which ranks the zeros and then drops their
 * ranks, is not offered; it can change the result when there are many zeros.
 *
 * Estimate: the median of the n(n+1)/2 Walsh averages (d_i + d_j)/2, i <= j, of all n differences
 * first - second (zeros included). Interval: Walsh-average order statistics chosen from the W+
 * distribution of all n (exact up to n = 50, else normal), see rank-inference.ts. For 1,000,000
 * pairs the 5e11 Walsh averages are never listed: rank-select.ts finds order statistics in
 * O(n log n). Effect size: the matched-pairs rank-biserial correlation r = (W+ - W-) / (W+ + W-)
 * (Kerby 2014, Comprehensive Psychology 3:11.IT.3.1), no interval.
 *
 * Worked example (invented: a bakery's proofing times, new minus old recipe, 10 batches):
 * differences 1.8, -0.6, 2.9, 0.4, 3.7, 1.1, -1.5, 2.2, 0.9, 3.1 give W+ = 48, exact two-sided
 * p = 0.03711 (twice P(W+ >= 48) = 19/1024), Hodges-Lehmann estimate 1.45, 95% interval
 * [0.15, 2.65] (Walsh averages 9 and 47 of 55); scipy 1.10 gives the same p-value.
 */
import { StatsError } from '../errors.js';
import { exactIntervalRanks, exactPValue, hodgesLehmann, normalIntervalRanks, normalPValue, pct, type IntervalRanks, type RankTestPart } from './rank-inference.js';
import { SIGNED_RANK_EXACT_MAX, signedRankCounts, tailsOf, twoPow } from './rank-exact.js';
import { MatrixSelector, walshMatrix } from './rank-select.js';
import { roundingTolerance, shiftedCopy, signedRankSweep, type SignedRankSummary } from './rank-ties.js';
import { checkCount, checkFinite, checkSameLength, scaleFor, show } from './sample.js';
import type { ProcedureOptions, TestResult } from './types.js';

const AUTO_EXACT_MAX = 50;

export function signedRank(first: number[], second: number[], o: ProcedureOptions): TestResult {
  checkSameLength(first, second, 'signed-rank');
  checkFinite(first, 'signed-rank, first condition');
  checkFinite(second, 'signed-rank, second condition');
  checkCount(first.length, 2, 'signed-rank, complete pairs', 'a single pair cannot show a systematic difference');
  const n = first.length;
  // One exact power-of-two scale keeps 1e308-sized data from overflowing in the differences.
  const f = scaleFor(first, second, [o.nullValue]);
  const raw = new Float64Array(n);
  let largest = 0;
  for (let i = 0; i < n; i++) {
    raw[i] = first[i] * f - second[i] * f;
    largest = Math.max(largest, Math.abs(first[i] * f) + Math.abs(second[i] * f));
  }
  raw.sort();
  const mu = o.nullValue * f;
  // Subtracting a constant keeps the order, so d stays sorted without a second sort.
  const d = mu === 0 ? raw : shiftedCopy(raw, mu);
  const s = signedRankSweep(d, roundingTolerance(largest + Math.abs(mu)));
  if (s.nonZero === 0) {
    throw new StatsError(
      'no-variation',
      `every difference first - second equals the null value ${show(o.nullValue)}${s.nearZeros > 0 ? ' (to rounding)' : ''}: no non-zero difference is left to rank, so the signed-rank test is undefined; the data show no difference from the null value at all`,
    );
  }
  const test = testPart(s, o);
  const sel = new MatrixSelector(walshMatrix(raw));
  const size = (n * (n + 1)) / 2;
  const ciExact = o.method !== 'normal' && n <= (o.method === 'exact' ? SIGNED_RANK_EXACT_MAX : AUTO_EXACT_MAX);
  const ranks: IntervalRanks = ciExact
    ? exactIntervalRanks(signedRankCounts(n), size, o.confidence, o.alternative, twoPow(n))
    : normalIntervalRanks(size, Math.sqrt((n * (n + 1) * (2 * n + 1)) / 24), o.confidence, o.alternative);
  const { estimate, ci } = hodgesLehmann(sel, ranks, f, o.alternative);
  const top = (s.nonZero * (s.nonZero + 1)) / 2;
  return {
    procedure: 'signed-rank',
    method: 'Wilcoxon signed-rank test on the paired differences',
    variant: test.variant,
    estimate,
    estimateName: 'Hodges-Lehmann estimate (median of the Walsh averages of first minus second)',
    ci,
    confidence: o.confidence,
    statistic: s.wPlus,
    statisticName: 'W+',
    df: null,
    pValue: test.pValue,
    alternative: o.alternative,
    nullValue: o.nullValue,
    n: { pairs: n, zeros: s.zeros, ties: s.tiedGroups },
    effectSize: {
      name: 'matched-pairs rank-biserial correlation',
      formula: '(W+ - W-) / (W+ + W-), ranks of the non-zero differences',
      value: (2 * s.wPlus) / top - 1,
      ci: null,
    },
    notes: [
      zeroNote(s, n, o.nullValue),
      test.note,
      intervalNote(ranks, n, size, ciExact, o, s.tiedGroups > 0 || s.zeros > 0),
      ...(s.nearTies + s.nearZeros > 0
        ? [`${s.nearTies + s.nearZeros} difference(s) differed from a tied value or from zero only by floating-point rounding and were treated as equal`]
        : []),
      'no interval is computed for the rank-biserial correlation',
    ],
    details: {
      wMinus: top - s.wPlus,
      rankedDifferences: s.nonZero,
      zerosDropped: s.zeros,
      zeroMethod: 'wilcox',
      meanW: top / 2,
      sdW: test.sd,
      z: test.z,
      continuityCorrection: test.correction,
      ciMethod: ciExact ? 'exact' : 'normal',
      ciLowerRank: ranks.lower,
      ciUpperRank: ranks.upper,
      walshAverages: size,
      achievedConfidence: ranks.achieved,
    },
  };
}

function testPart(s: SignedRankSummary, o: ProcedureOptions): RankTestPart {
  const m = s.nonZero;
  const clean = s.tiedGroups === 0 && s.zeros === 0;
  const limit = o.method === 'exact' ? SIGNED_RANK_EXACT_MAX : AUTO_EXACT_MAX;
  if (o.method !== 'normal' && clean && m <= limit) {
    const p = exactPValue(tailsOf(signedRankCounts(m), s.wPlus, twoPow(m)), o.alternative);
    return {
      pValue: p,
      variant: 'exact null distribution of W+',
      note: `p-value from the exact null distribution of W+ for ${m} differences without ties or zeros`,
      z: null,
      sd: null,
      correction: null,
    };
  }
  const correction = o.correction ?? true;
  const top = (m * (m + 1)) / 2;
  const sd = Math.sqrt((m * (m + 1) * (2 * m + 1)) / 24 - s.tieTerm / 48);
  const { z, pValue } = normalPValue(s.wPlus, top / 2, sd, o.alternative, correction);
  const why = !clean
    ? `the exact distribution assumes no ties and no zeros; here ${[s.tiedGroups > 0 ? `${s.tiedGroups} group(s) of tied absolute differences` : '', s.zeros > 0 ? `${s.zeros} zero(s)` : ''].filter(Boolean).join(' and ')}`
    : o.method === 'normal'
      ? 'normal approximation requested'
      : `the exact distribution is used up to ${limit} differences; here ${m}`;
  const asked = o.method === 'exact' ? 'exact p-value requested, but ' : '';
  return {
    pValue,
    variant: `normal approximation${s.tiedGroups > 0 ? ' with tie correction' : ''}${correction ? ' and continuity correction' : ''}`,
    note:
      `p-value from the normal approximation to W+ (mean ${show(top / 2)}, SD ${show(Number(sd.toPrecision(6)))}${s.tiedGroups > 0 ? ', tie-corrected' : ''}), ` +
      `${correction ? 'with' : 'without'} continuity correction (${asked}${why})` +
      (m < 10 ? '; with fewer than 10 ranked differences the approximation is rough' : ''),
    z,
    sd,
    correction,
  };
}

function zeroNote(s: SignedRankSummary, n: number, nullValue: number): string {
  if (s.zeros === 0) return `no difference equals the null value ${show(nullValue)}, so no pair is dropped (zero differences would be dropped before ranking: Wilcoxon's method)`;
  const verb = s.zeros === 1 ? 'equals' : 'equal';
  return `${s.zeros} of ${n} differences ${verb} the null value ${show(nullValue)} and ${s.zeros === 1 ? 'is' : 'are'} dropped before ranking (Wilcoxon's method), leaving ${s.nonZero}; the Hodges-Lehmann estimate and interval use all ${n}`;
}

function intervalNote(r: IntervalRanks, n: number, size: number, exact: boolean, o: ProcedureOptions, ties: boolean): string {
  const which = [r.lower === null ? null : `${r.lower}`, r.upper === null ? null : `${r.upper}`].filter((x) => x !== null).join(' and ');
  const side = o.alternative === 'greater' ? '; one-sided (upper end +Infinity)' : o.alternative === 'less' ? '; one-sided (lower end -Infinity)' : '';
  const base = `interval: Walsh averages ${which} of ${size} in order (all ${n} differences), critical value from the ${exact ? 'exact' : 'normal approximation to the'} W+ distribution; achieved confidence ${pct(r.achieved)}${side}`;
  const caveat = exact && ties ? '; with tied or zero differences the achieved confidence is approximate (usually a little higher)' : '';
  return r.short ? `${base}${caveat}; too few pairs to reach ${pct(o.confidence)}: this is the widest interval the data allow` : base + caveat;
}
