/**
 * Order statistics of the Hodges-Lehmann matrices without building them.
 *
 * The signed-rank estimate needs order statistics of the M = n(n+1)/2 Walsh averages
 * (d_i + d_j)/2, i <= j; the rank-sum estimate needs those of the m n differences x_i - y_j.
 * For 1,000,000 pairs M is 5e11, far too many to list. Both are sums r_i + c_j of two ascending
 * arrays (Walsh: r = c = d/2, upper triangle j >= i; shift: r = x, c = -y read from its top), so
 * every row and every column is sorted, and the number of entries below any value t is counted in
 * O(rows + cols) by one pointer walking down the columns as the rows go up.
 *
 * Selection keeps, per row, the band of columns that may still hold the k-th entry (Monahan 1984,
 * "Algorithm 616: fast computation of the Hodges-Lehmann location estimator", ACM TOMS
 * 10:265-270; Johnson and Mizoguchi 1978, "Selecting the Kth element in X + Y and
 * X1 + X2 + ... + Xm", SIAM J. Computing 7:147-153). Each round draws a random sample of the
 * active entries and takes two sample order statistics that bracket the target rank (Floyd and
 * Rivest 1975, "Expected time bounds for selection", CACM 18:165-172), counts below both in one
 * sweep, and narrows every band to the side or the bracket holding the target. A sample of 16384
 * keeps about 2% of the active entries per round, so 5e11 shrinks in four or five rounds to the
 * ~1e6 that are then listed and selected directly: O(n log n) in all. Draws come from a
 * fixed-seed generator: results never depend on them (only the running time does), and every
 * round removes at least one pivot, so the loop always ends. Several order statistics (the median
 * and the interval ends) share their rounds while one bracket holds them all, then each is
 * finished from the shared bands; for 1e6 pairs that saves about a third of the sweeps.
 *
 * Example: differences 1, 2, 4 give Walsh averages 1, 1.5, 2, 2.5, 3, 4; the 3rd smallest is 2.
 */
import { bandTotals, countBelow, countPair, drawSample, listActive, minFrom, narrow, quickselect, resetBands, type SumMatrix } from './rank-matrix.js';

export { shiftMatrix, walshMatrix, type SumMatrix } from './rank-matrix.js';

const SAMPLE = 16384;
const SPREAD = 1.5 * Math.sqrt(SAMPLE);

/**
 * Reusable selection workspace for one matrix (buffers allocated once, so several order statistics
 * cost no extra garbage). The work is split into small functions on purpose: each stays hot and
 * type-stable in the JIT.
 */
export class MatrixSelector {
  private readonly lo: Int32Array;
  private readonly hi: Int32Array;
  private readonly edgeA: Int32Array;
  private readonly edgeB: Int32Array;
  private readonly prefix: Float64Array;
  private readonly sample = new Float64Array(SAMPLE);
  private readonly threshold: number;
  private buffer: Float64Array | undefined;

  constructor(private readonly m: SumMatrix) {
    const R = m.r.length;
    this.lo = new Int32Array(R);
    this.hi = new Int32Array(R);
    this.edgeA = new Int32Array(R);
    this.edgeB = new Int32Array(R);
    this.prefix = new Float64Array(R + 1);
    this.threshold = Math.max(1 << 16, R);
  }

  /** The k-th smallest entry, k = 1..size. */
  kth(k: number): number {
    return this.kths([k])[0];
  }

  /**
   * Several order statistics at once. While all target ranks fit in one bracket, the rounds are
   * shared (for the Hodges-Lehmann median and interval ends of 1e6 pairs the first two rounds
   * are); then each target is finished from a copy of the shared bands.
   */
  kths(ranks: number[]): number[] {
    const { m, lo, hi, edgeA, edgeB, prefix, sample } = this;
    for (const k of ranks) if (!(k >= 1 && k <= m.size)) throw new RangeError(`rank ${k} outside 1..${m.size}`);
    const kMin = Math.min(...ranks);
    const kMax = Math.max(...ranks);
    resetBands(m, lo, hi);
    const random = generator(0x9e3779b9 ^ kMin);
    let [active, below] = bandTotals(m, lo, hi, prefix);
    while (active > this.threshold && ranks.length > 1) {
      drawSample(m, lo, prefix, active, sample, random);
      const from = Math.floor(((kMin - below) / active) * SAMPLE - SPREAD);
      const to = Math.ceil(((kMax - below) / active) * SAMPLE + SPREAD);
      // Stop sharing once the bracket would keep more than half of the active entries.
      if (to - from > SAMPLE / 2) break;
      const pLo = sample[clamp(from, 0, SAMPLE - 1)];
      const pHi = sample[clamp(to, 0, SAMPLE - 1)];
      const [lessLo, lessHi] = countPair(m, pLo, pHi, lo, hi, edgeA, edgeB);
      if (kMin <= lessLo || kMax > lessHi) break;
      [active, below] = narrow(m, lo, hi, edgeA, edgeB, prefix);
    }
    if (active <= this.threshold) {
      // Everything left fits in the buffer: list once, select every rank from it.
      const listed = listActive(m, lo, hi, active, this.workspace());
      return ranks.map((k) => quickselect(listed, k - below - 1));
    }
    const savedLo = ranks.length > 1 ? lo.slice() : lo;
    const savedHi = ranks.length > 1 ? hi.slice() : hi;
    const found = new Map<number, number>();
    for (const k of ranks) {
      if (found.has(k)) continue;
      lo.set(savedLo);
      hi.set(savedHi);
      const [value, next] = this.finish(k, random);
      found.set(k, value);
      // The next order statistic often comes free from the same listing (the median's pair).
      if (next !== undefined && ranks.includes(k + 1)) found.set(k + 1, next);
    }
    return ranks.map((k) => found.get(k) as number);
  }

  private workspace(): Float64Array {
    this.buffer ??= new Float64Array(this.threshold);
    return this.buffer;
  }

  /**
   * Single-target selection from the current bands: the k-th entry, and the (k+1)-th when the final
   * listing holds it.
   */
  private finish(k: number, random: () => number): [number, number | undefined] {
    const { m, lo, hi, edgeA, edgeB, prefix, sample } = this;
    let [active, below] = bandTotals(m, lo, hi, prefix);
    for (;;) {
      const rank = k - below;
      if (active <= this.threshold) {
        const listed = listActive(m, lo, hi, active, this.workspace());
        const value = quickselect(listed, rank - 1);
        return [value, rank < active ? minFrom(listed, rank) : undefined];
      }
      drawSample(m, lo, prefix, active, sample, random);
      const at = (rank / active) * SAMPLE;
      const pLo = sample[clamp(Math.floor(at - SPREAD), 0, SAMPLE - 1)];
      const pHi = sample[clamp(Math.ceil(at + SPREAD), 0, SAMPLE - 1)];
      const [lessLo, lessHi] = countPair(m, pLo, pHi, lo, hi, edgeA, edgeB);
      if (k <= lessLo) {
        // Target below pLo: drop every entry >= pLo.
        [active, below] = narrow(m, lo, hi, null, edgeA, prefix);
      } else if (k <= lessHi) {
        // pLo <= target < pHi: drop entries < pLo and >= pHi (pHi itself leaves the active set).
        [active, below] = narrow(m, lo, hi, edgeA, edgeB, prefix);
      } else {
        // Target >= pHi: is it pHi itself? Otherwise drop every entry <= pHi.
        if (k <= countBelow(m, pHi, false, edgeB)) return [pHi, undefined];
        [active, below] = narrow(m, lo, hi, edgeB, null, prefix);
      }
    }
  }

  /** Median of all entries (mean of the two middle ones when the count is even). */
  median(): number {
    return this.medianAnd([])[0];
  }

  /** The median together with other order statistics, all in one batch: [median, ...values]. */
  medianAnd(ranks: number[]): number[] {
    const size = this.m.size;
    const middle = size % 2 === 1 ? [(size + 1) / 2] : [size / 2, size / 2 + 1];
    const values = this.kths([...middle, ...ranks]);
    const med = middle.length === 1 ? values[0] : values[0] * 0.5 + values[1] * 0.5;
    return [med, ...values.slice(middle.length)];
  }
}

function clamp(x: number, a: number, b: number): number {
  return x < a ? a : x > b ? b : x;
}

/** mulberry32 (a small public-domain generator), two draws combined into a double in [0, 1). */
function generator(seed: number): () => number {
  let a = seed | 0;
  const next32 = (): number => {
    a = (a + 0x6d2b79f5) | 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return (t ^ (t >>> 14)) >>> 0;
  };
  return () => ((next32() >>> 5) * 67108864 + (next32() >>> 6)) / 9007199254740992;
}
