/**
 * The implicit sorted matrices behind the Hodges-Lehmann estimates, and the sweeps over them that
 * rank-select.ts combines into selection.
 *
 * Both matrices are sums r_i + c_j of two ascending arrays: the Walsh averages (d_i + d_j)/2 with
 * r = c = d/2 over the upper triangle j >= i, and the pairwise differences x_i - y_j with r = x and
 * c = -y read from its top. Every row and every column is then sorted, so the entries below a
 * value t are counted in O(rows + cols) by one pointer that only moves left as the rows go up.
 * The sweeps take plain typed arrays (no callbacks), so the JIT compiles them into tight loops.
 *
 * Example: d = 1, 2, 4 gives r = c = 0.5, 1, 2 and entries 1, 1.5, 2.5 / 2, 3 / 4; countBelow(2.5,
 * strict) is 3.
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

export function resetBands(m: SumMatrix, lo: Int32Array, hi: Int32Array): void {
  const cols = m.c.length;
  for (let i = 0; i < lo.length; i++) {
    lo[i] = m.triangular ? i : 0;
    hi[i] = cols;
  }
}

/** Active entries (with the running prefix per row, for sampling) and entries left of the bands. */
export function bandTotals(m: SumMatrix, lo: Int32Array, hi: Int32Array, prefix: Float64Array): [number, number] {
  return narrow(m, lo, hi, null, null, prefix);
}

/** Raise lo to `up` and lower hi to `down` where given, then total the bands in the same sweep. */
export function narrow(m: SumMatrix, lo: Int32Array, hi: Int32Array, up: Int32Array | null, down: Int32Array | null, prefix: Float64Array): [number, number] {
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
export function countPair(m: SumMatrix, a: number, b: number, lo: Int32Array, hi: Int32Array, edgeA: Int32Array, edgeB: Int32Array): [number, number] {
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
export function drawSample(m: SumMatrix, lo: Int32Array, prefix: Float64Array, active: number, sample: Float64Array, random: () => number): void {
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

/** Copies the active entries into `buffer` and returns the filled view. */
export function listActive(m: SumMatrix, lo: Int32Array, hi: Int32Array, active: number, buffer: Float64Array): Float64Array {
  const { r, c } = m;
  const a = buffer.subarray(0, active);
  let p = 0;
  for (let i = 0; i < lo.length; i++) {
    const ri = r[i];
    for (let j = lo[i]; j < hi[i]; j++) a[p++] = ri + c[j];
  }
  return a;
}

/** Smallest of a[from..]: after quickselect at from - 1, the next order statistic. */
export function minFrom(a: Float64Array, from: number): number {
  let best = Infinity;
  for (let i = from; i < a.length; i++) if (a[i] < best) best = a[i];
  return best;
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
