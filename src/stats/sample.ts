/**
 * Shared sample helpers for the t family (paired, Welch, pooled, crossover, equivalence): input
 * checks with messages that say what was wrong and where, an exact power-of-two rescaling so that
 * values near 1e300 neither overflow nor lose digits, and a numerically stable mean and variance.
 *
 * Mean and variance: the corrected two-pass algorithm (Chan, Golub and LeVeque 1983, "Algorithms
 * for computing the sample variance: analysis and recommendations", The American Statistician 37):
 *   m  = sum(x) / n,   m' = m + sum(x - m) / n
 *   s2 = (sum((x - m)^2) - (sum(x - m))^2 / n) / (n - 1)
 * The second term removes the first-order error of m, so s2 keeps its digits even when the mean is
 * large compared with the spread (e.g. values 1e9 + 0.1, 1e9 + 0.2, ...).
 *
 * Rescaling: every procedure multiplies its data by one power of two f (`scaleFor`) so that the
 * largest magnitude lies in [0.5, 1). Multiplying by a power of two is exact in binary floating
 * point, so ordinary data give bit-identical results, while 1e300-sized data no longer overflow
 * in sums, squares or differences. Results are divided by f at the end.
 *
 * Example: summarize([2, 4, 4, 5]) gives mean 3.75, variance 1.583333..., sd 1.258305...
 */
import { StatsError } from '../errors.js';

export interface Summary {
  n: number;
  mean: number;
  /** Sample variance with divisor n - 1 (0 when n = 1). */
  variance: number;
  sd: number;
  min: number;
  max: number;
}

/** Throws StatsError 'not-finite' naming the first NaN or infinite value and its position (1-based). */
export function checkFinite(values: ArrayLike<number>, label: string): void {
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (typeof v !== 'number' || !Number.isFinite(v)) {
      throw new StatsError(
        'not-finite',
        `${label}: value #${i + 1} is ${String(v)}; only finite numbers can be analysed (drop or mark the missing or broken value before the analysis)`,
      );
    }
  }
}

/** Throws StatsError 'too-few' when fewer than `min` values (or pairs) are available. */
export function checkCount(n: number, min: number, what: string, why: string): void {
  if (n < min) throw new StatsError('too-few', `${what}: needs at least ${min}, got ${n}; ${why}`);
}

/** Paired data: both members of every pair must be present. */
export function checkSameLength(first: ArrayLike<number>, second: ArrayLike<number>, what: string): void {
  if (first.length !== second.length) {
    throw new StatsError(
      'invalid-option',
      `${what}: the first condition has ${first.length} values and the second ${second.length}; paired data need one value of each per pair`,
    );
  }
}

/** The power of two f that brings the largest magnitude among the arrays into [0.5, 1); 1 for all zeros. */
export function scaleFor(...arrays: ArrayLike<number>[]): number {
  let m = 0;
  for (const a of arrays) for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i]));
  if (m === 0) return 1;
  // frexp-style exponent; the loop below corrects log2 rounding at exact powers of two.
  let e = Math.floor(Math.log2(m)) + 1;
  while (m * Math.pow(2, -e) >= 1) e++;
  while (m * Math.pow(2, -e) < 0.5) e--;
  // 2^-e must itself be representable: cap the upscaling of subnormal data.
  return Math.pow(2, -Math.max(e, -1000));
}

/** Largest magnitude of the values (used for the rounding-level variation test). */
export function maxAbs(...arrays: ArrayLike<number>[]): number {
  let m = 0;
  for (const a of arrays) for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i]));
  return m;
}

/** Mean and sample variance of `values` multiplied by `scale`, by the corrected two-pass algorithm. */
export function summarize(values: ArrayLike<number>, scale = 1): Summary {
  const n = values.length;
  if (n === 0) return { n: 0, mean: NaN, variance: NaN, sd: NaN, min: NaN, max: NaN };
  let sum = 0;
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < n; i++) {
    const x = values[i] * scale;
    sum += x;
    if (x < min) min = x;
    if (x > max) max = x;
  }
  if (min === max) return { n, mean: min, variance: 0, sd: 0, min, max };
  let m = sum / n;
  let dev = 0;
  let dev2 = 0;
  for (let i = 0; i < n; i++) {
    const d = values[i] * scale - m;
    dev += d;
    dev2 += d * d;
  }
  const variance = n > 1 ? Math.max(0, (dev2 - (dev * dev) / n) / (n - 1)) : 0;
  m += dev / n;
  // The correction can only move the mean within [min, max]; clamp against rounding.
  m = Math.min(max, Math.max(min, m));
  return { n, mean: m, variance, sd: Math.sqrt(variance), min, max };
}

/**
 * True when a sample's spread is no larger than floating-point rounding of its inputs can make it:
 * the range is at most 4 units in the last place of the largest input magnitude (`inputScale`,
 * in the same scaled units). Differences of decimal inputs such as 1.3 - 0.9 and 2.4 - 2.0 are not
 * bit-identical, yet they show no real variation.
 */
export function isRoundingLevel(s: Summary, inputScale: number): boolean {
  return s.max - s.min <= 4 * Number.EPSILON * inputScale;
}

/** A value for messages: 12 significant digits, so 0.4000000000000001 reads as 0.4. */
export function show(x: number): string {
  return String(Number(x.toPrecision(12)));
}

/**
 * StatsError 'no-variation' for a sample whose values are all equal, e.g.
 * noVariation('differences', 'difference', 0.4): "all differences are equal (every difference is
 * 0.4): the t statistic is undefined; the data show no variation to test against".
 */
export function noVariation(plural: string, singular: string, commonValue: number, extra = ''): StatsError {
  return new StatsError(
    'no-variation',
    `all ${plural} are equal (every ${singular} is ${show(commonValue)}): the t statistic is undefined; the data show no variation to test against${extra}`,
  );
}

/** Two independent groups in one common scale, checked; shared by Welch, pooled and equivalence. */
export interface IndependentCore {
  scale: number;
  first: Summary;
  second: Summary;
}

/**
 * Checks two independent groups (finite, at least `minEach` values each) and summarizes them in a
 * common scale. A group whose spread is at rounding level counts as constant (variance 0); both
 * constant is StatsError 'no-variation'.
 */
export function independentCore(first: number[], second: number[], what: string, minEach: number, why: string): IndependentCore {
  checkFinite(first, `${what}, first group`);
  checkFinite(second, `${what}, second group`);
  checkCount(first.length, minEach, `${what}, first group`, why);
  checkCount(second.length, minEach, `${what}, second group`, why);
  const scale = scaleFor(first, second);
  const s1 = constantIfRounding(summarize(first, scale), maxAbs(first) * scale);
  const s2 = constantIfRounding(summarize(second, scale), maxAbs(second) * scale);
  if (s1.variance === 0 && s2.variance === 0) {
    throw new StatsError(
      'no-variation',
      `both groups are constant (every first-group value is ${show(s1.mean / scale)}, every second-group value is ${show(s2.mean / scale)}): the t statistic is undefined; the data show no variation to test against`,
    );
  }
  return { scale, first: s1, second: s2 };
}

function constantIfRounding(s: Summary, inputScale: number): Summary {
  return s.variance > 0 && isRoundingLevel(s, inputScale) ? { ...s, variance: 0, sd: 0 } : s;
}

/** Note for a group without spread (the other group carries the whole estimate of spread). */
export function constantGroupNotes(c: IndependentCore): string[] {
  const out: string[] = [];
  const say = (g: Summary, name: string, other: string): void => {
    if (g.variance > 0) return;
    const why = g.n === 1 ? 'has a single value' : `shows no variation (every value is ${show(g.mean / c.scale)})`;
    out.push(`the ${name} group ${why}; the spread estimate rests on the ${other} group alone`);
  };
  say(c.first, 'first', 'second');
  say(c.second, 'second', 'first');
  return out;
}
