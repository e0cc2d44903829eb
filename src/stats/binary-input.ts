/**
 * Checks for binary outcomes: every value must be 0 (no event) or 1 (event). Counting happens
 * here too, so each procedure reads its table from one place.
 *
 * Example: countEvents([1, 0, 1, 1], 'x') is 3.
 */
import { StatsError } from '../errors.js';
import { checkFinite } from './sample.js';

/** Throws StatsError 'not-finite' or 'not-binary' naming the first bad value and its position (1-based). */
export function checkBinary(values: ArrayLike<number>, label: string): void {
  checkFinite(values, label);
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (v !== 0 && v !== 1) {
      throw new StatsError(
        'not-binary',
        `${label}: value #${i + 1} is ${String(v)}; binary outcomes must be coded 0 (no event) or 1 (event)`,
      );
    }
  }
}

/** Number of 1s in a checked binary array. */
export function countEvents(values: ArrayLike<number>): number {
  let k = 0;
  for (let i = 0; i < values.length; i++) k += values[i];
  return k;
}

/** Paired 2x2 table: a = both 1, b = first 1 only, c = second 1 only, d = both 0. */
export function pairedTable(first: ArrayLike<number>, second: ArrayLike<number>): { a: number; b: number; c: number; d: number } {
  let a = 0;
  let b = 0;
  let c = 0;
  for (let i = 0; i < first.length; i++) {
    if (first[i] === 1) {
      if (second[i] === 1) a++;
      else b++;
    } else if (second[i] === 1) c++;
  }
  return { a, b, c, d: first.length - a - b - c };
}
