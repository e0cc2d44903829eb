/**
 * Terminal plots in plain characters: a histogram of each sample on one shared scale, with the
 * estimate ('o') and its interval ('[' to ']') marked under it, and a reference value ('|', e.g.
 * a difference of zero) on the axis. No colours and no box-drawing characters, so the plot reads
 * the same in a terminal, a log file, an e-mail or a Markdown code block.
 *
 * Example (five differences 1, 2, 2, 3, 7; estimate 3 with interval [0.1, 5.9]; reference 0):
 *
 *     |      #
 *     |   #  #  #              #
 *     +---------+-----------------+
 *     0         3                 7
 *       [=======o========]
 */
import { fmt } from './style.js';

export interface Strip {
  label: string;
  values: ArrayLike<number>;
  /** The estimate marked 'o' (e.g. the mean difference), with its interval; ends may be infinite. */
  estimate?: number;
  interval?: [number, number] | null;
}

export interface PlotOptions {
  /** Characters across the plotting area. */
  width?: number;
  /** Rows of the histogram of each strip. */
  height?: number;
  /** A value drawn on the axis as '|', e.g. a difference of 0. */
  reference?: { value: number; label: string };
  /** Legend for the marks, e.g. "o mean difference  [ ] 95% interval". */
  legend?: string;
}

export function plotStrips(strips: Strip[], opts: PlotOptions = {}): string {
  const width = Math.max(20, opts.width ?? 60);
  const height = Math.max(1, opts.height ?? (strips.length > 1 ? 4 : 6));
  const range = scaleOf(strips, opts.reference?.value);
  if (!range) return '(nothing to plot: no finite values)';
  const [lo, hi] = range;
  const pos = (x: number): number => Math.max(0, Math.min(width - 1, Math.round(((x - lo) / (hi - lo)) * (width - 1))));
  const out: string[] = [];
  for (const s of strips) {
    out.push(s.label);
    out.push(...histogram(s.values, width, height, pos));
    out.push(axis(width, pos, opts.reference?.value));
    out.push(labels(width, pos, lo, hi, opts.reference));
    const marks = markers(s, width, pos);
    if (marks) out.push(marks);
  }
  if (opts.legend) out.push(opts.legend);
  return out.join('\n');
}

/** The shared scale: all finite values, finite interval ends and the reference; widened if flat. */
function scaleOf(strips: Strip[], reference: number | undefined): [number, number] | null {
  let lo = Infinity;
  let hi = -Infinity;
  const see = (x: number | undefined): void => {
    if (x !== undefined && Number.isFinite(x)) {
      if (x < lo) lo = x;
      if (x > hi) hi = x;
    }
  };
  for (const s of strips) {
    for (let i = 0; i < s.values.length; i++) see(s.values[i]);
    see(s.estimate);
    if (s.interval) s.interval.forEach(see);
  }
  if (lo === Infinity) return null;
  see(reference);
  if (lo === hi) {
    const pad = lo === 0 ? 1 : Math.abs(lo) * 0.1;
    return [lo - pad, hi + pad];
  }
  return [lo, hi];
}

function histogram(values: ArrayLike<number>, width: number, height: number, pos: (x: number) => number): string[] {
  const counts = new Float64Array(width);
  for (let i = 0; i < values.length; i++) if (Number.isFinite(values[i])) counts[pos(values[i])]++;
  let max = 0;
  for (const c of counts) if (c > max) max = c;
  // Few values: one '#' per value, so the plot shows exact counts rather than stretched bars.
  height = Math.max(1, Math.min(height, max));
  const rows: string[] = [];
  for (let level = height; level >= 1; level--) {
    let row = '';
    for (const c of counts) {
      const h = max === 0 ? 0 : (c / max) * height;
      if (h >= level - 0.5) row += '#';
      else if (level === 1 && c > 0) row += '.';
      else row += ' ';
    }
    rows.push('|' + row.trimEnd());
  }
  return rows;
}

function axis(width: number, pos: (x: number) => number, reference: number | undefined): string {
  const a = Array.from({ length: width }, () => '-');
  if (reference !== undefined && Number.isFinite(reference)) a[pos(reference)] = '|';
  return '+' + a.join('');
}

function labels(width: number, pos: (x: number) => number, lo: number, hi: number, reference: PlotOptions['reference']): string {
  const line = Array.from({ length: width + 1 }, () => ' ');
  const put = (at: number, text: string): void => {
    const start = Math.max(0, Math.min(width + 1 - text.length, at));
    for (let i = 0; i < text.length; i++) line[start + i] = text[i];
  };
  const left = fmt(lo, 3);
  const right = fmt(hi, 3);
  put(0, left);
  put(width + 1 - right.length, right);
  if (reference && Number.isFinite(reference.value)) {
    const text = fmt(reference.value, 3);
    const at = pos(reference.value) + 1 - Math.floor(text.length / 2);
    const clear = at > left.length + 1 && at + text.length < width + 1 - right.length - 1;
    if (clear) put(at, text);
  }
  return line.join('').trimEnd();
}

function markers(s: Strip, width: number, pos: (x: number) => number): string | null {
  if (s.estimate === undefined || !Number.isFinite(s.estimate)) return null;
  const line = Array.from({ length: width }, () => ' ');
  if (s.interval) {
    const [a, b] = s.interval;
    const from = Number.isFinite(a) ? pos(a) : 0;
    const to = Number.isFinite(b) ? pos(b) : width - 1;
    for (let i = from; i <= to; i++) line[i] = '=';
    line[from] = Number.isFinite(a) ? '[' : '<';
    line[to] = Number.isFinite(b) ? ']' : '>';
  }
  line[pos(s.estimate)] = 'o';
  return ' ' + line.join('').trimEnd();
}
