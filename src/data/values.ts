/** Turning a value column into numbers per row, whether it was read as numbers or as 0/1 text. */
import { InputError } from '../errors.js';
import { binaryMap } from './binary.js';
import type { CategoryColumn, Column, OutcomeSpec, Table } from './types.js';

/** Reads row r of a value column: a number, or NaN when missing. */
export type RowValue = (r: number) => number;

export function column(table: Table, name: string): Column {
  const c = table.columns[name];
  if (!c) throw new Error(`column '${name}' was not read`);
  return c;
}

export function category(table: Table, name: string): CategoryColumn {
  const c = column(table, name);
  if (c.kind !== 'category') throw new Error(`column '${name}' was read as numbers`);
  return c;
}

/**
 * Value readers for one or more value columns. Binary outcomes share one mapping across the
 * columns, so 'yes' means the event in both members of a pair.
 */
export function valueReaders(table: Table, names: string[], outcome: OutcomeSpec): RowValue[] {
  const cols = names.map((n) => column(table, n));
  if (!outcome.binary) {
    return cols.map((c) => {
      if (c.kind !== 'number') throw new Error(`column '${c.name}' was read as text`);
      const v = c.values;
      return (r) => v[r];
    });
  }
  const levelsOf = (c: CategoryColumn): string[] => Array.from({ length: Math.min(c.levelCount, 20) }, (_, k) => c.level(k));
  const texts = cols.flatMap((c) => levelsOf(c as CategoryColumn));
  const where = `${table.file}, column${names.length > 1 ? 's' : ''} ${names.map((n) => `'${n}'`).join(' and ')}`;
  if (texts.length === 0) throw new InputError(`${where}: no values`);
  const map = binaryMap(texts, outcome.event, where);
  return cols.map((c) => {
    const cc = c as CategoryColumn;
    const byCode = Float64Array.from(levelsOf(cc), (l) => map.get(l)!);
    return (r) => (cc.codes[r] < 0 ? NaN : byCode[cc.codes[r]]);
  });
}

/**
 * A plain array with room for n doubles (what the procedures take), to be filled by index.
 * Starting from a one-double literal and setting the length makes V8 allocate the double store
 * once: `new Array(n)` starts as an array of small integers and copies itself (leaving 8 MB of
 * garbage per million values) at the first double written; Array.from and push grow in steps.
 * Measured here: a third of the memory and time of `new Array(n)`.
 */
export function numberArray(n: number): number[] {
  const a = [0.5];
  a.length = n;
  return a;
}

/** Shortens an array built by numberArray to the n values filled. */
export function truncate(a: number[], n: number): number[] {
  if (a.length !== n) a.length = n;
  return a;
}

/** A typed buffer's first n values as a plain array. */
export function toArray(a: Float64Array, n: number): number[] {
  const out = numberArray(n);
  for (let i = 0; i < n; i++) out[i] = a[i];
  return out;
}
