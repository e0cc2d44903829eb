/**
 * An account of how the data pair up, taken straight from the table (pure): ids that repeat
 * within a condition, ids measured under one condition only, incomplete pairs, complete pairs,
 * and what each condition would count if incomplete pairs were kept. The data layer refuses
 * repeated ids as bad input; the audit instead reports them as findings, so it counts them here.
 *
 * Example: a long table with ids A1, A1 (first), A2 (first only) and A3 (both) has one duplicate,
 * one unmatched id and one complete pair.
 */
import type { CategoryColumn, LayoutSpec, OutcomeSpec, Table } from '../data/types.js';
import { valueReaders } from '../data/values.js';

export interface PairingAccount {
  /** Statements for the review, in plain words. */
  lines: string[];
  /** Ids that occur more than once (within one condition for long data). */
  duplicates: { id: string; times: number; lines: number[] }[];
  /** Ids with a measurement under one condition only. */
  unmatched: string[];
  /** Pairs with one member missing (dropped whole by a paired analysis). */
  incomplete: number;
  /** Complete pairs (paired layouts). */
  pairs?: number;
  /** Values per condition if every non-missing value were kept (what an unpaired analysis uses). */
  firstValues: number[];
  secondValues: number[];
}

function cat(table: Table, name: string | undefined): CategoryColumn | undefined {
  if (name === undefined) return undefined;
  const c = table.columns[name];
  return c && c.kind === 'category' ? c : undefined;
}

export function accountPairing(table: Table, m: LayoutSpec, outcome: OutcomeSpec): PairingAccount {
  const acc: PairingAccount = { lines: [], duplicates: [], unmatched: [], incomplete: 0, firstValues: [], secondValues: [] };
  if (m.layout === 'wide') {
    const [a, b] = valueReaders(table, [m.first, m.second], outcome);
    const id = cat(table, m.id);
    if (id) acc.duplicates = repeats(table, id, (r) => id.codes[r]);
    let pairs = 0;
    for (let r = 0; r < table.rows; r++) {
      const x = a(r);
      const y = b(r);
      if (x === x) acc.firstValues.push(x);
      if (y === y) acc.secondValues.push(y);
      if (x === x && y === y) pairs++;
      else if (x === x || y === y) acc.incomplete++;
    }
    acc.pairs = pairs;
    acc.lines.push(m.pairBy === 'row-order' || !id ? `pairs formed by row: each row is one unit (no id column)` : `pairs identified by the id column '${m.id}', one row per unit`);
  } else if (m.layout === 'long') {
    const id = cat(table, m.id)!;
    const cond = cat(table, m.condition)!;
    const f = m.firstLevel !== undefined ? cond.find(m.firstLevel) : 0;
    const s = m.secondLevel !== undefined ? cond.find(m.secondLevel) : 1;
    const [value] = valueReaders(table, [m.value], outcome);
    const side = (r: number): number => (cond.codes[r] === f ? 0 : cond.codes[r] === s ? 1 : -1);
    acc.duplicates = repeats(table, id, (r) => (id.codes[r] < 0 || side(r) < 0 ? -1 : id.codes[r] * 2 + side(r)), (k) => `${id.level(k >> 1)} (${cond.level(k & 1 ? s : f)})`);
    const seen = new Map<number, [number, number]>();
    for (let r = 0; r < table.rows; r++) {
      const sd = side(r);
      if (sd < 0 || id.codes[r] < 0) continue;
      const v = value(r);
      if (v === v) (sd === 0 ? acc.firstValues : acc.secondValues).push(v);
      const cur = seen.get(id.codes[r]) ?? [NaN, NaN];
      cur[sd] = v;
      seen.set(id.codes[r], cur);
    }
    let pairs = 0;
    for (const [k, [x, y]] of seen) {
      if (x === x && y === y) pairs++;
      else {
        acc.incomplete++;
        if (x === x || y === y) acc.unmatched.push(id.level(k));
      }
    }
    acc.pairs = pairs;
    acc.lines.push(`pairs joined by the id column '${m.id}'`);
  } else if (m.layout === 'columns') {
    const [a, b] = valueReaders(table, [m.first, m.second], outcome);
    for (let r = 0; r < table.rows; r++) {
      const x = a(r);
      const y = b(r);
      if (x === x) acc.firstValues.push(x);
      if (y === y) acc.secondValues.push(y);
    }
    acc.lines.push('two separate columns: no link between a value in one and a value in the other');
  } else if (m.layout === 'groups') {
    const g = cat(table, m.group)!;
    const f = m.firstLevel !== undefined ? g.find(m.firstLevel) : 0;
    const s = m.secondLevel !== undefined ? g.find(m.secondLevel) : 1;
    const [value] = valueReaders(table, [m.value], outcome);
    for (let r = 0; r < table.rows; r++) {
      const v = value(r);
      if (v !== v) continue;
      if (g.codes[r] === f) acc.firstValues.push(v);
      else if (g.codes[r] === s) acc.secondValues.push(v);
    }
    const id = cat(table, m.id);
    if (id) acc.duplicates = repeats(table, id, (r) => id.codes[r]);
    acc.lines.push(`groups from the column '${m.group}'`);
  } else {
    const seq = cat(table, m.sequence)!;
    const [p1, p2] = valueReaders(table, [m.period1, m.period2], outcome);
    const ab = m.firstThenSecond !== undefined ? seq.find(m.firstThenSecond) : -2;
    for (let r = 0; r < table.rows; r++) {
      const x = p1(r);
      const y = p2(r);
      if (!(x === x && y === y)) {
        if (x === x || y === y) acc.incomplete++;
        continue;
      }
      // The first condition's value is period 1 in sequence first-then-second, period 2 otherwise.
      const firstFirst = seq.codes[r] === ab;
      acc.firstValues.push(firstFirst ? x : y);
      acc.secondValues.push(firstFirst ? y : x);
    }
    acc.pairs = acc.firstValues.length;
    const id = cat(table, m.id);
    if (id) acc.duplicates = repeats(table, id, (r) => id.codes[r]);
    acc.lines.push(`one row per subject: sequence in '${m.sequence}', periods in '${m.period1}' and '${m.period2}'`);
  }
  if (acc.incomplete > 0) acc.lines.push(`${acc.incomplete} incomplete pair${acc.incomplete === 1 ? '' : 's'} (one member missing), dropped whole by a paired analysis`);
  if (acc.unmatched.length > 0) acc.lines.push(`${acc.unmatched.length} id${acc.unmatched.length === 1 ? '' : 's'} measured under one condition only: ${acc.unmatched.slice(0, 8).join(', ')}${acc.unmatched.length > 8 ? ', ...' : ''}`);
  if (acc.duplicates.length > 0) acc.lines.push(`${acc.duplicates.length} repeated id${acc.duplicates.length === 1 ? '' : 's'}: ${acc.duplicates.slice(0, 6).map((d) => `${d.id} (${d.times} times, lines ${d.lines.join(', ')})`).join('; ')}`);
  if (acc.pairs !== undefined) acc.lines.push(`${acc.pairs} complete pair${acc.pairs === 1 ? '' : 's'}`);
  acc.lines.push(`${acc.pairs === undefined ? 'values per condition' : 'values per condition if nothing is paired'}: ${acc.firstValues.length} and ${acc.secondValues.length}`);
  return acc;
}

function repeats(table: Table, id: CategoryColumn, key: (r: number) => number, label: (k: number) => string = (k) => id.level(k)): PairingAccount['duplicates'] {
  const rows = new Map<number, number[]>();
  for (let r = 0; r < table.rows; r++) {
    const k = key(r);
    if (k < 0) continue;
    const list = rows.get(k);
    if (list) list.push(table.lineOf(r));
    else rows.set(k, [table.lineOf(r)]);
  }
  return [...rows].filter(([, ls]) => ls.length > 1).map(([k, ls]) => ({ id: label(k), times: ls.length, lines: ls.slice(0, 5) }));
}
