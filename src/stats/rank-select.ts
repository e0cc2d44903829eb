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
 * round removes at least one pivot, so the loop always ends.
 *
 * Example: differences 1, 2, 4 give Walsh averages 1, 1.5, 2, 2.5, 3, 4; the 3rd smallest is 2.
 */

/** Entries r[i] + c[j] for 0 <= i < r.length and first(i) <= j < c.length, first(i) = i if triangular. */
export interface SumMatrix {
  r: Float64Array;
  c: Float64Array;
  triangular: boolean;
  size: number;
}

/** Walsh averages of an ascending array (i <= j); averaging by halves cannot overflow. */
export function walshMatrix(sorted: Float64Array): SumMatrix {
  const n = sorted.length;
  const h = new Float64Array(n);
  for (let i = 0; i < n; i++) h[i] = sorted[i] * 0.5;
  return { r: h, c: h, triangular: true, size: (n * (n + 1)) / 2 };
}

/** Differences x_i - y_j of two ascending arrays. */
export function shiftMatrix(x: Float64Array, y: Float64Array): SumMatrix {
  const top = y.length - 1;
  const c = new Float64Array(y.length);
  for (let j = 0; j <= top; j++) c[j] = -y[top - j];
  return { r: x, c, triangular: false, size: x.length * y.length };
}

/**
 * Number of entries < t (strict) or <= t over the whole matrix; if `edge` is given, edge[i]
 * receives the first column of row i whose entry is >= t (strict) or > t.
 */
export function countBelow(m: SumMatrix, t: number, strict: boolean, edge?: Int32Array): number {
  const { r, c, triangular } = m;
  let j = c.length;
  let count = 0;
  for (let i = 0; i < r.length; i++) {
    const ri = r[i];
    if (strict) while (j > 0 && ri + c[j - 1] >= t) j--;
    else while (j > 0 && ri + c[j - 1] > t) j--;
    if (edge) edge[i] = j;
    const f = triangular ? i : 0;
    if (j > f) count += j - f;
  }
  return count;
}

/** The smallest entry strictly greater than v (Infinity if none). */
export function successor(m: SumMatrix, v: number): number {
  const { r, c, triangular } = m;
  let j = c.length;
  let best = Infinity;
  for (let i = 0; i < r.length; i++) {
    const ri = r[i];
    while (j > 0 && ri + c[j - 1] > v) j--;
    const col = triangular && i > j ? i : j;
    if (col < c.length && ri + c[col] < best) best = ri + c[col];
  }
  return best;
}

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
    const { m, lo, hi, edgeA, edgeB, prefix, sample } = this;
    if (!(k >= 1 && k <= m.size)) throw new RangeError(`rank ${k} outside 1..${m.size}`);
    resetBands(m, lo, hi);
    const random = generator(0x9e3779b9 ^ k);
    let [active, below] = bandTotals(m, lo, hi, prefix);
    for (;;) {
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
        [active, below] = narrow(m, lo, hi, null, edgeA, prefix);
      } else if (k <= lessHi) {
        // pLo <= target < pHi: drop entries < pLo and >= pHi (pHi itself leaves the active set).
        [active, below] = narrow(m, lo, hi, edgeA, edgeB, prefix);
      } else {
        // Target >= pHi: is it pHi itself? Otherwise drop every entry <= pHi.
        if (k <= countBelow(m, pHi, false, edgeB)) return pHi;
        [active, below] = narrow(m, lo, hi, edgeB, null, prefix);
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
export function selectKth(m: SumMatrix, k: number): number {
  return new MatrixSelector(m).kth(k);
}

export function matrixMedian(m: SumMatrix): number {
  return new MatrixSelector(m).median();
}

function resetBands(m: SumMatrix, lo: Int32Array, hi: Int32Array): void {
  const cols = m.c.length;
  for (let i = 0; i < lo.length; i++) {
    lo[i] = m.triangular ? i : 0;
    hi[i] = cols;
  }
}

/** Active entries (with the running prefix per row, for sampling) and entries left of the bands. */
function bandTotals(m: SumMatrix, lo: Int32Array, hi: Int32Array, prefix: Float64Array): [number, number] {
  return narrow(m, lo, hi, null, null, prefix);
}

/** Raise lo to `up` and lower hi to `down` where given, then total the bands in the same sweep. */
function narrow(m: SumMatrix, lo: Int32Array, hi: Int32Array, up: Int32Array | null, down: Int32Array | null, prefix: Float64Array): [number, number] {
  let active = 0;
  let below = 0;
  const tri = m.triangular;
  for (let i = 0; i < lo.length; i++) {
    if (up !== null && up[i] > lo[i]) lo[i] = up[i];
    if (down !== null && down[i] < hi[i]) hi[i] = down[i];
    prefix[i] = active;
    const w = hi[i] - lo[i];
    if (w > 0) active += w;
    below += lo[i] - (tri ? i : 0);
  }
  prefix[lo.length] = active;
  return [active, below];
}

/**
 * Counts below two values at once (entries < a and entries < b, a <= b), one pointer per value,
 * each walking only inside the rows' active bands. Valid because every entry left of a band is
 * below every active entry and every entry right of it above, and a, b are active entries; the
 * walk then costs O(rows + min(cols, active)).
 */
function countPair(m: SumMatrix, a: number, b: number, lo: Int32Array, hi: Int32Array, edgeA: Int32Array, edgeB: Int32Array): [number, number] {
  const { r, c, triangular } = m;
  let ja = c.length;
  let jb = c.length;
  let ca = 0;
  let cb = 0;
  for (let i = 0; i < r.length; i++) {
    const l = lo[i];
    const h = hi[i] > l ? hi[i] : l;
    const ri = r[i];
    if (ja > h) ja = h;
    if (ja < l) ja = l;
    while (ja > l && ri + c[ja - 1] >= a) ja--;
    if (jb > h) jb = h;
    if (jb < l) jb = l;
    while (jb > l && ri + c[jb - 1] >= b) jb--;
    edgeA[i] = ja;
    edgeB[i] = jb;
    const f = triangular ? i : 0;
    ca += ja - f;
    cb += jb - f;
  }
  return [ca, cb];
}

/** Uniform draws from the active entries: positions drawn, sorted, then met in one sweep of the rows. */
function drawSample(m: SumMatrix, lo: Int32Array, prefix: Float64Array, active: number, sample: Float64Array, random: () => number): void {
  const { r, c } = m;
  for (let s = 0; s < sample.length; s++) sample[s] = Math.floor(random() * active);
  sample.sort();
  let i = 0;
  for (let s = 0; s < sample.length; s++) {
    const u = sample[s];
    while (prefix[i + 1] <= u) i++;
    sample[s] = r[i] + c[lo[i] + (u - prefix[i])];
  }
  sample.sort();
}

function listAndSelect(m: SumMatrix, lo: Int32Array, hi: Int32Array, active: number, rank: number, buffer: Float64Array): number {
  const { r, c } = m;
  const a = buffer.subarray(0, active);
  let p = 0;
  for (let i = 0; i < lo.length; i++) {
    const ri = r[i];
    for (let j = lo[i]; j < hi[i]; j++) a[p++] = ri + c[j];
  }
  return quickselect(a, rank - 1);
}

/** In-place selection of index r (0-based) with three-way partitioning, so ties cost nothing. */
export function quickselect(a: Float64Array, r: number): number {
  let left = 0;
  let right = a.length - 1;
  while (right > left) {
    const pivot = median3(a[left], a[(left + right) >>> 1], a[right]);
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
