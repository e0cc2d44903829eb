/**
 * Reading one CSV cell: a missing marker, a number, or a problem that says what was wrong.
 *
 * Both CSV readers (the fast scan and papaparse) hand every cell to the functions here, so the
 * two paths turn the same text into the same value by construction.
 *
 * Accepted numbers are plain decimals with an optional exponent: `12`, `-0.5`, `.25`, `3.`,
 * `1.2e-3`, surrounded by optional spaces. Hexadecimal, `Infinity`, `NaN`, thousands separators
 * and decimal commas are refused with a message, because `Number()` would accept some of them
 * silently (`Number('0x1A')` is 26, `Number('')` is 0).
 */

/** Missing markers by default: the empty cell (always missing) and `NA`. */
export const DEFAULT_MISSING: readonly string[] = ['', 'NA'];

const DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const NOT_A_MEASUREMENT = /^[+-]?(nan|inf|infinity)$/i;

/** The outcome of reading a numeric cell. */
export type NumberCell =
  | { kind: 'value'; value: number }
  | { kind: 'missing' }
  | { kind: 'problem'; message: string; hint: string };

/** Missing markers as a set; the empty cell is always among them. */
export function missingSet(markers: readonly string[] | undefined): Set<string> {
  const set = new Set((markers ?? DEFAULT_MISSING).map((m) => m.trim()));
  set.add('');
  return set;
}

/** The reference reading of a numeric cell (the fast path must agree with it). */
export function readNumberCell(raw: string, missing: ReadonlySet<string>): NumberCell {
  const s = raw.trim();
  if (missing.has(s)) return { kind: 'missing' };
  if (DECIMAL.test(s)) {
    const value = Number(s);
    if (!Number.isFinite(value)) {
      // e.g. 1e400: beyond the largest double (about 1.8e308), it would silently become Infinity.
      return {
        kind: 'problem',
        message: `'${short(s)}' is beyond the largest number tandem can hold (about 1.8e308)`,
        hint: 'rescale the column (e.g. to thousands) or check the value for a typing error',
      };
    }
    return { kind: 'value', value };
  }
  if (NOT_A_MEASUREMENT.test(s)) {
    return {
      kind: 'problem',
      message: `'${short(s)}' is not a measurement`,
      hint: `leave the cell empty or write a missing marker (${[...missing].filter((m) => m).join(', ') || 'none set'})`,
    };
  }
  const hint = /^[+-]?\d+,\d+$/.test(s)
    ? 'a decimal comma? tandem reads the point as decimal separator: write 12.5, not 12,5'
    : `expected a number such as 12.5 or a missing marker (${[...missing].map((m) => (m === '' ? 'empty cell' : m)).join(', ')})`;
  return { kind: 'problem', message: `'${short(s)}' is not a number`, hint };
}

/** True when some marker looks like a number (e.g. -99): the fast number scan must then step aside. */
export function hasNumericMarker(missing: ReadonlySet<string>): boolean {
  for (const m of missing) if (m !== '' && DECIMAL.test(m)) return true;
  return false;
}

/** Exact powers of ten: every one up to 1e22 is a double without rounding. */
const POW10 = Array.from({ length: 23 }, (_, k) => Number(`1e${k}`));

/**
 * A fast reading of `text.slice(start, end)` for the common plain decimal: a sign, at most 15
 * digits, at most 22 after the point, no exponent, no spaces. Returns the value, or NaN when the
 * cell is not that simple and must go through `readNumberCell`.
 *
 * Exactness: the digits form an integer m < 10^15 < 2^53, held exactly, and 10^k for k <= 22 is
 * exact, so m / 10^k is one correctly rounded division: the same double `Number()` returns
 * (Clinger 1990, "How to read floating point numbers accurately", the fast path).
 * Example: "-12.75" gives m = 1275, k = 2, value -12.75.
 */
export function fastNumber(text: string, start: number, end: number): number {
  let i = start;
  let negative = false;
  let c = text.charCodeAt(i);
  if (c === 45 || c === 43) {
    negative = c === 45;
    i++;
  }
  let m = 0;
  let digits = 0;
  let frac = 0;
  let point = false;
  for (; i < end; i++) {
    c = text.charCodeAt(i);
    if (c >= 48 && c <= 57) {
      m = m * 10 + (c - 48);
      digits++;
      if (point) frac++;
    } else if (c === 46 && !point) {
      point = true;
    } else {
      return NaN;
    }
  }
  if (digits === 0 || digits > 15 || frac > 22) return NaN;
  const v = frac === 0 ? m : m / POW10[frac];
  return negative ? -v : v;
}

/**
 * The same over UTF-8 bytes, for the plain scan: writes the value into out[at] and returns true,
 * or returns false when the cell needs `readNumberCell`. A number is ASCII, where a byte and a
 * character code agree. The body is repeated rather than shared, and the value is stored rather
 * than returned, so that the loop stays monomorphic and no number is boxed on the heap: this runs
 * once per cell of a million-row file.
 */
export function fastNumberBytes(bytes: Uint8Array, start: number, end: number, out: number[], at: number): boolean {
  let i = start;
  let negative = false;
  let c = bytes[i];
  if (c === 45 || c === 43) {
    negative = c === 45;
    i++;
  }
  let m = 0;
  let digits = 0;
  let frac = 0;
  let point = false;
  for (; i < end; i++) {
    c = bytes[i];
    if (c >= 48 && c <= 57) {
      m = m * 10 + (c - 48);
      digits++;
      if (point) frac++;
    } else if (c === 46 && !point) {
      point = true;
    } else {
      return false;
    }
  }
  if (digits === 0 || digits > 15 || frac > 22) return false;
  const v = frac === 0 ? m : m / POW10[frac];
  out[at] = negative ? -v : v;
  return true;
}

function short(s: string): string {
  return s.length > 40 ? s.slice(0, 37) + '...' : s;
}
