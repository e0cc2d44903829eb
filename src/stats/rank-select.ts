/**
 * Order statistics of the Hodges-Lehmann matrices without building them.
 *
 * The signed-rank estimate needs order statistics of the M = n(n+1)/2 Walsh averages
 * (d_i + d_j)/2, i <= j; the rank-sum estimate needs those of the m n differences x_i - y_j.
 * For 1,000,000 pairs M is 5e11, far too many to list. Both are "sorted matrices": with the data
 * sorted, row i is non-decreasing along j and column j is non-decreasing along i. So the number
 * of entries below any value t is counted in O(rows + cols) by one pointer walking down the
 * columns as the rows go up (the boundary in row i+1 is never right of the one in row i).
 *
 * Selection keeps, per row, the range of columns that may still hold the k-th entry (Monahan
 * 1984, "Algorithm 616: fast computation of the Hodges-Lehmann location estimator", ACM TOMS
 * 10:265-270; Johnson and Mizoguchi 1978, "Selecting the Kth element in X + Y and
 * X1 + X2 + ... + Xm", SIAM J. Computing 7:147-153). Each round draws a random sample of the
 * active entries and takes two sample order statistics that bracket the target rank (Floyd and
 * Rivest 1975, "Expected time bounds for selection", CACM 18:165-172), counts below both with
 * the pointer walk, and narrows every row to the side or the bracket holding the target. With a
 * sample of 4096 a round keeps about 5% of the active entries, so 5e11 shrinks to the ~1e6 that
 * are then listed and selected directly in about five rounds: O(n log n) in all. The draws come
 * from a fixed-seed generator, so results are reproducible; they never depend on the draws, only
 * the running time does. Every round removes at least its pivots, so the loop always ends.
 *
 * Example: differences 1, 2, 4 give Walsh averages 1, 1.5, 2, 2.5, 3, 4; the 3rd smallest is 2.
 */

/** An implicit matrix: entry (i, j) for 0 <= i < rows, first(i) <= j < cols, sorted as above. */
export interface SortedMatrix {
  rows: number;
  cols: number;
  /** Number of entries. */
  size: number;
  first(i: number): number;
  value(i: number, j: number): number;
}

/** Walsh averages of an ascending array (i <= j); averaging by halves cannot overflow. */
export function walshMatrix(sorted: Float64Array): SortedMatrix {
  const n = sorted.length;
  return {
    rows: n,
    cols: n,
    size: (n * (n + 1)) / 2,
    first: (i) => i,
    value: (i, j) => sorted[i] * 0.5 + sorted[j] * 0.5,
  };
}

/** Differences x_i - y_j of two ascending arrays (y walked from its top so rows ascend). */
export function shiftMatrix(x: Float64Array, y: Float64Array): SortedMatrix {
  const top = y.length - 1;
  return {
    rows: x.length,
    cols: y.length,
    size: x.length * y.length,
    first: () => 0,
    value: (i, j) => x[i] - y[top - j],
  };
}

/**
 * Number of entries < t (strict) or <= t; if `edge` is given, edge[i] receives the first column of
 * row i whose entry is >= t (strict) or > t.
 */
export function countBelow(m: SortedMatrix, t: number, strict: boolean, edge?: Int32Array): number {
  let j = m.cols;
  let count = 0;
  for (let i = 0; i < m.rows; i++) {
    if (strict) while (j > 0 && m.value(i, j - 1) >= t) j--;
    else while (j > 0 && m.value(i, j - 1) > t) j--;
    if (edge) edge[i] = j;
    const f = m.first(i);
    if (j > f) count += j - f;
  }
  return count;
}

/** The smallest entry strictly greater than v (Infinity if none). */
export function successor(m: SortedMatrix, v: number): number {
  let j = m.cols;
  let best = Infinity;
  for (let i = 0; i < m.rows; i++) {
    while (j > 0 && m.value(i, j - 1) > v) j--;
    const col = Math.max(j, m.first(i));
    if (col < m.cols) {
      const w = m.value(i, col);
      if (w < best) best = w;
    }
  }
  return best;
}

const SAMPLE = 16384;
const SPREAD = 1.5 * Math.sqrt(SAMPLE);

/**
 * Counts below two values at once (strict: entries < a and entries < b, a <= b), walking one
 * pointer per value inside each row's active band [lo, hi). Valid when every entry left of a band
 * is below both values and every entry right of it is above both, which holds for values drawn
 * from the active entries; the walk then costs O(rows + min(cols, active)).
 */
function countPair(m: SortedMatrix, a: number, b: number, lo: Int32Array, hi: Int32Array, edgeA: Int32Array, edgeB: Int32Array): [number, number] {
  let ja = m.cols;
  let jb = m.cols;
  let ca = 0;
  let cb = 0;
  for (let i = 0; i < m.rows; i++) {
    const l = lo[i];
    const h = hi[i];
    if (h <= l) {
      // Empty band: the boundary is the band itself; keep the pointers monotone.
      if (ja > l) ja = Math.max(l, Math.min(ja, h));
      if (jb > l) jb = Math.max(l, Math.min(jb, h));
      edgeA[i] = l;
      edgeB[i] = l;
      ca += l - m.first(i);
      cb += l - m.first(i);
      continue;
    }
    if (ja > h) ja = h;
    if (ja < l) ja = l;
    while (ja > l && m.value(i, ja - 1) >= a) ja--;
    if (jb > h) jb = h;
    if (jb < l) jb = l;
    while (jb > l && m.value(i, jb - 1) >= b) jb--;
    edgeA[i] = ja;
    edgeB[i] = jb;
    const f = m.first(i);
    ca += ja - f;
    cb += jb - f;
  }
  return [ca, cb];
}

/**
 * Reusable selection workspace for one matrix (buffers allocated once, so several order statistics
 * of the same matrix cost no extra garbage). The work is split into small functions on purpose:
 * each stays hot and type-stable in the JIT.
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

  constructor(private readonly m: SortedMatrix) {
    const R = m.rows;
    this.lo = new Int32Array(R);
    this.hi = new Int32Array(R);
    this.edgeA = new Int32Array(R);
    this.edgeB = new Int32Array(R);
    this.prefix = new Float64Array(R + 1);
    this.threshold = Math.max(1 << 16, R);
  }

  /** The k-th smallest entry, k = 1..size. */
  kth(k: number): number {
    const { m, lo, hi, edgeA, edgeB, prefix, sample } = this;
    if (!(k >= 1 && k <= m.size)) throw new RangeError(`rank ${k} outside 1..${m.size}`);
    resetBands(m, lo, hi);
    const random = generator(0x9e3779b9 ^ k);
    for (;;) {
      const [active, below] = bandTotals(m, lo, hi, prefix);
      const rank = k - below;
      if (active <= this.threshold) {
        this.buffer ??= new Float64Array(this.threshold);
        return listAndSelect(m, lo, hi, active, rank, this.buffer);
      }
      drawSample(m, lo, prefix, active, sample, random);
      const at = (rank / active) * SAMPLE;
      const pLo = sample[clamp(Math.floor(at - SPREAD), 0, SAMPLE - 1)];
      const pHi = sample[clamp(Math.ceil(at + SPREAD), 0, SAMPLE - 1)];
      const [lessLo, lessHi] = countPair(m, pLo, pHi, lo, hi, edgeA, edgeB);
      if (k <= lessLo) {
        // Target below pLo: drop every entry >= pLo.
        hi.set(edgeA);
      } else if (k <= lessHi) {
        // pLo <= target < pHi: drop entries < pLo and >= pHi (pHi itself leaves the active set).
        lo.set(edgeA);
        hi.set(edgeB);
      } else {
        // Target >= pHi: is it pHi itself? Otherwise drop every entry <= pHi.
        if (k <= countBelow(m, pHi, false, edgeB)) return pHi;
        raise(lo, edgeB);
      }
    }
  }

  /** The k-th and (k+1)-th smallest entries (the (k+1)-th is Infinity when k = size). */
  pair(k: number): [number, number] {
    const a = this.kth(k);
    if (k >= this.m.size) return [a, Infinity];
    const b = countBelow(this.m, a, false) >= k + 1 ? a : successor(this.m, a);
    return [a, b];
  }

  /** Median of all entries (mean of the two middle ones when the count is even). */
  median(): number {
    const size = this.m.size;
    if (size % 2 === 1) return this.kth((size + 1) / 2);
    const [a, b] = this.pair(size / 2);
    return a * 0.5 + b * 0.5;
  }
}

/** The k-th smallest entry (one-off; use MatrixSelector for several). */
export function selectKth(m: SortedMatrix, k: number): number {
  return new MatrixSelector(m).kth(k);
}

export function matrixMedian(m: SortedMatrix): number {
  return new MatrixSelector(m).median();
}

function resetBands(m: SortedMatrix, lo: Int32Array, hi: Int32Array): void {
  for (let i = 0; i < m.rows; i++) {
    lo[i] = m.first(i);
    hi[i] = m.cols;
  }
}

/** Active entries (with the running prefix per row, for sampling) and entries left of the bands. */
function bandTotals(m: SortedMatrix, lo: Int32Array, hi: Int32Array, prefix: Float64Array): [number, number] {
  let active = 0;
  let below = 0;
  for (let i = 0; i < m.rows; i++) {
    prefix[i] = active;
    const w = hi[i] - lo[i];
    if (w > 0) active += w;
    below += lo[i] - m.first(i);
  }
  prefix[m.rows] = active;
  return [active, below];
}

/** Uniform draws from the active entries: positions drawn, sorted, then met in one sweep of the rows. */
function drawSample(m: SortedMatrix, lo: Int32Array, prefix: Float64Array, active: number, sample: Float64Array, random: () => number): void {
  for (let s = 0; s < sample.length; s++) sample[s] = Math.floor(random() * active);
  sample.sort();
  let i = 0;
  for (let s = 0; s < sample.length; s++) {
    const u = sample[s];
    while (prefix[i + 1] <= u) i++;
    sample[s] = m.value(i, lo[i] + (u - prefix[i]));
  }
  sample.sort();
}

function raise(lo: Int32Array, edge: Int32Array): void {
  for (let i = 0; i < lo.length; i++) if (edge[i] > lo[i]) lo[i] = edge[i];
}

function listAndSelect(m: SortedMatrix, lo: Int32Array, hi: Int32Array, active: number, rank: number, buffer: Float64Array): number {
  const a = buffer.subarray(0, active);
  let p = 0;
  for (let i = 0; i < m.rows; i++) for (let j = lo[i]; j < hi[i]; j++) a[p++] = m.value(i, j);
  return quickselect(a, rank - 1);
}

/** In-place selection of index r (0-based) with three-way partitioning, so ties cost nothing. */
export function quickselect(a: Float64Array, r: number): number {
  let left = 0;
  let right = a.length - 1;
  while (right > left) {
    const mid = (left + right) >>> 1;
    const pivot = median3(a[left], a[mid], a[right]);
    let lt = left;
    let gt = right;
    let i = left;
    while (i <= gt) {
      const v = a[i];
      if (v < pivot) {
        a[i++] = a[lt];
        a[lt++] = v;
      } else if (v > pivot) {
        a[i] = a[gt];
        a[gt--] = v;
      } else i++;
    }
    if (r < lt) right = lt - 1;
    else if (r > gt) left = gt + 1;
    else return pivot;
  }
  return a[r];
}

function median3(a: number, b: number, c: number): number {
  return a < b ? (b < c ? b : a < c ? c : a) : a < c ? a : b < c ? c : b;
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
