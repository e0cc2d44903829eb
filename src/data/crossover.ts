/**
 * The 2x2 crossover, one row per subject: the sequence the subject followed and the values in
 * period 1 and period 2. The sequence values must be named (which sequence received the first
 * condition in period 1 decides the sign of every effect), unless the plan or the user named one
 * and exactly one other value occurs. A subject with a value missing is dropped whole.
 */
import { InputError } from '../errors.js';
import { listLevels, repeatedIds, twoLevels } from './levels.js';
import type { LayoutOf, OutcomeSpec, PreparedData, Table } from './types.js';
import { category, toArray, valueReaders } from './values.js';

type Crossover = LayoutOf<'crossover'>;

export function prepareCrossover(table: Table, m: Crossover, outcome: OutcomeSpec): PreparedData {
  if (m.firstThenSecond === undefined && m.secondThenFirst === undefined) {
    throw new InputError(
      `name the sequence that received the first condition in period 1 (--first-then-second VALUE, or the plan's data.firstThenSecond): tandem does not guess it, because it sets the sign of the treatment effect`,
    );
  }
  const notes: string[] = [];
  const seq = category(table, m.sequence);
  if (seq.levelCount > 2) {
    throw new InputError(`${table.file}: column '${m.sequence}' has ${seq.levelCount} sequences (${listLevels(seq)}); a 2x2 crossover has two`);
  }
  const lv = twoLevels(seq, m.firstThenSecond, m.secondThenFirst, table.file);
  if (m.id !== undefined) {
    const idCol = category(table, m.id);
    repeatedIds(table, idCol, (r) => idCol.codes[r], idCol.levelCount, 'each subject has one row holding both periods', (k) => `subject '${idCol.level(k)}' appears`);
  }
  const [p1, p2] = valueReaders(table, [m.period1, m.period2], outcome);
  const buf = [new Float64Array(table.rows), new Float64Array(table.rows), new Float64Array(table.rows), new Float64Array(table.rows)];
  const n = [0, 0];
  let dropped = 0;
  let other = 0;
  for (let r = 0; r < table.rows; r++) {
    const s = seq.codes[r] === lv.first ? 0 : seq.codes[r] === lv.second ? 1 : -1;
    if (s < 0) {
      if (seq.codes[r] < 0) dropped++;
      else other++;
      continue;
    }
    const x = p1(r);
    const y = p2(r);
    if (x !== x || y !== y) {
      dropped++;
      continue;
    }
    buf[2 * s][n[s]] = x;
    buf[2 * s + 1][n[s]] = y;
    n[s]++;
  }
  if (other > 0) {
    const found = listLevels(seq);
    throw new InputError(`${table.file}: column '${m.sequence}' has ${seq.levelCount} sequences (${found}); a 2x2 crossover has two`);
  }
  const [s1, s2] = [seq.level(lv.first), seq.level(lv.second)];
  if (dropped > 0) notes.push(`${dropped} subject${dropped === 1 ? '' : 's'} with a missing value or sequence dropped whole`);
  notes.push(`sequence '${s1}' took the first condition in period 1; sequence '${s2}' took the second condition in period 1`);
  if (n[0] === 0 || n[1] === 0) {
    throw new InputError(`${table.file}: sequence '${n[0] === 0 ? s1 : s2}' has no complete subjects; the crossover analysis needs both sequences`);
  }
  return {
    input: {
      kind: 'crossover',
      firstThenSecond: { period1: toArray(buf[0], n[0]), period2: toArray(buf[1], n[0]) },
      secondThenFirst: { period1: toArray(buf[2], n[1]), period2: toArray(buf[3], n[1]) },
    },
    layout: 'crossover',
    // The data name sequences, not conditions: say which condition each side is.
    sides: { first: `the condition given first in sequence '${s1}'`, second: `the condition given first in sequence '${s2}'` },
    sequences: { firstThenSecond: s1, secondThenFirst: s2 },
    counts: { rows: table.rows, pairs: n[0] + n[1], first: n[0], second: n[1], dropped },
    notes,
    warnings: [],
  };
}
