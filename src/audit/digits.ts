/**
 * Reading a reported number with the digits as written, and the range of true values that the
 * written digits allow.
 *
 * A value rounded to its last written place lies within half a unit of that place: "0.0430" stands
 * for a value in [0.04295, 0.04305], "2.1" for [2.05, 2.15], "1.20e-5" for [1.195e-5, 1.205e-5].
 * Trailing zeros count ("0.0430" says more than "0.043"), which is why the text is read from the
 * YAML source and not from the parsed number. A bound ("< 0.001", "p <= .05") says only on which
 * side the value lies. Truncated rather than rounded reports fall outside this rule; the messages
 * say "allowing for rounding" so a reviewer can judge.
 *
 * Example: parseReported("0.0430") gives value 0.043, halfUnit 0.00005, significant 3.
 */
import type { ReportedNumber } from './types.js';

const NUMBER = /^([-+]?)(\d+\.?\d*|\.\d+)(?:[eE]([-+]?\d+))?$/;
const BOUND = /^(<=|>=|<|>|≤|≥|=)?\s*/;

export type ParseResult = { ok: true; number: ReportedNumber } | { ok: false; message: string };

/**
 * Parses a reported number. Accepts an optional leading "p", an optional relation (=, <, <=, >,
 * >=, or the symbols), a decimal or scientific number. Decimal commas and words are refused with
 * a message saying what is allowed.
 */
export function parseReported(raw: string | number): ParseResult {
  let text = String(raw).trim();
  const original = text;
  text = text.replace(/^[pP]\s*/, '');
  const rel = BOUND.exec(text);
  let bound: ReportedNumber['bound'];
  if (rel && rel[1] && rel[1] !== '=') bound = rel[1] === '≤' ? '<=' : rel[1] === '≥' ? '>=' : (rel[1] as ReportedNumber['bound']);
  text = text.slice(rel ? rel[0].length : 0).trim();
  const m = NUMBER.exec(text);
  if (!m) {
    const hint = /^\d+,\d+$/.test(text) ? ' (write a decimal point, not a comma)' : '';
    return { ok: false, message: `'${original}' is not a number as written${hint}; allowed: 0.0430, -2.14, 1.2e-5, or a bound such as "< 0.001"` };
  }
  const [, sign, mantissa, exp] = m;
  const value = Number(`${sign}${mantissa}${exp !== undefined ? 'e' + exp : ''}`);
  if (!Number.isFinite(value)) return { ok: false, message: `'${original}' is too large to be a reported number` };
  const decimals = mantissa.includes('.') ? mantissa.length - mantissa.indexOf('.') - 1 : 0;
  const exponent = exp !== undefined ? Number(exp) : 0;
  const halfUnit = 0.5 * Math.pow(10, exponent - decimals);
  const digits = mantissa.replace('.', '').replace(/^0+/, '');
  const significant = Math.max(1, digits.length);
  const number: ReportedNumber = { text: original, value, halfUnit, significant };
  if (bound) number.bound = bound;
  return { ok: true, number };
}

/** The interval of true values the written number allows: rounding for values, a side for bounds. */
export function rangeOf(r: ReportedNumber, exact = false): [number, number] {
  const h = exact ? 0 : r.halfUnit;
  switch (r.bound) {
    case '<':
    case '<=':
      return [-Infinity, r.value];
    case '>':
    case '>=':
      return [r.value, Infinity];
    default:
      return [r.value - h, r.value + h];
  }
}

/** True when two closed intervals share a point, with a relative slack for floating point. */
export function overlaps(a: [number, number], b: [number, number], rel = 1e-9): boolean {
  const slack = rel * Math.max(1e-300, Math.abs(a[0]), Math.abs(a[1]), Math.abs(b[0]), Math.abs(b[1]));
  return a[0] <= b[1] + slack && b[0] <= a[1] + slack;
}

/** The distance between two intervals (0 when they overlap). */
export function gap(a: [number, number], b: [number, number]): number {
  if (overlaps(a, b, 0)) return 0;
  return a[1] < b[0] ? b[0] - a[1] : a[0] - b[1];
}

/**
 * The range of f over a box of inputs, evaluated at every corner and the centre. Exact for
 * functions monotone in each input over the box, which holds for the recomputations here (a tail
 * probability in |t| and df, an interval end in estimate, statistic and quantile) over the small
 * boxes that rounding leaves. Inputs where f is undefined (NaN) are skipped; when none is left the
 * result is [NaN, NaN] (see isRange).
 */
export function rangeOver(boxes: [number, number][], f: (...x: number[]) => number): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  const k = boxes.length;
  const visit = (x: number[]): void => {
    const v = f(...x);
    if (Number.isNaN(v)) return;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  };
  for (let mask = 0; mask < 1 << k; mask++) visit(boxes.map((b, i) => ((mask >> i) & 1 ? b[1] : b[0])));
  visit(boxes.map((b) => (b[0] + b[1]) / 2));
  return lo <= hi ? [lo, hi] : [NaN, NaN];
}

/** False for the [NaN, NaN] that rangeOver returns when no input gave a number. */
export function isRange(r: [number, number]): boolean {
  return r[0] <= r[1];
}

/** A confidence level as written: 0.95, "95%", "95" or "0.95" -> 0.95. */
export function parseLevel(raw: string | number): number | undefined {
  const s = String(raw).trim().replace(/%$/, '').trim();
  const v = Number(s);
  if (!Number.isFinite(v) || s === '') return undefined;
  const frac = v > 1 ? v / 100 : v;
  return frac > 0 && frac < 1 ? frac : undefined;
}

/** A recomputed number for a message: `digits` significant digits, plain notation when readable. */
export function show(x: number, digits = 4): string {
  if (Number.isNaN(x)) return 'n/a';
  if (!Number.isFinite(x)) return x > 0 ? 'infinity' : '-infinity';
  if (x === 0) return '0';
  const a = Math.abs(x);
  if (a >= 1e-4 && a < 1e9) return String(Number(x.toPrecision(digits)));
  return x.toExponential(digits - 1);
}

/** A recomputed range for a message: "0.0412" when narrow, "0.0409 to 0.0415" otherwise. */
export function showRange([lo, hi]: [number, number], digits = 4): string {
  const a = show(lo, digits);
  const b = show(hi, digits);
  return a === b ? a : `${a} to ${b}`;
}
