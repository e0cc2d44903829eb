/**
 * Paired data, one row per measurement: an id column says which unit, a condition column says
 * which of the two conditions, a value column holds the measurement. Pairs are joined by id.
 * An id with the same condition twice is an error (which one would be the unit's value?); an id
 * with only one of the two conditions is an unmatched id: its pair is incomplete, dropped, counted
 * and named.
 */
import { InputError } from '../errors.js';
import { listLevels, repeatedIds, twoLevels } from './levels.js';
import type { LayoutOf, OutcomeSpec, PreparedData, Table } from './types.js';
import { category, toArray, valueReaders } from './values.js';

type Long = LayoutOf<'long'>;

export function prepareLong(table: Table, m: Long, outcome: OutcomeSpec): PreparedData {
  const notes: string[] = [];
  const warnings: string[] = [];
  const idCol = category(table, m.id);
  const cond = category(table, m.condition);
  const lv = twoLevels(cond, m.firstLevel, m.secondLevel, table.file);
  if (lv.note) notes.push(lv.note);
  const [value] = valueReaders(table, [m.value], outcome);
  const side = (r: number): number => (cond.codes[r] === lv.first ? 0 : cond.codes[r] === lv.second ? 1 : -1);
  const ids = idCol.levelCount;
  repeatedIds(table, idCol, (r) => (idCol.codes[r] < 0 || side(r) < 0 ? -1 : idCol.codes[r] * 2 + side(r)), ids * 2,
    'each unit has one measurement per condition', (k) => `id '${idCol.level(k >> 1)}' with condition '${cond.level(k & 1 ? lv.second : lv.first)}' appears`);

  const firstVal = new Float64Array(ids).fill(NaN);
  const secondVal = new Float64Array(ids).fill(NaN);
  const seen = new Uint8Array(ids);
  let noId = 0;
  let otherLevel = 0;
  let noCondition = 0;
  for (let r = 0; r < table.rows; r++) {
    const id = idCol.codes[r];
    if (cond.codes[r] < 0) {
      noCondition++;
      continue;
    }
    const s = side(r);
    if (s < 0) {
      otherLevel++;
      continue;
    }
    if (id < 0) {
      noId++;
      continue;
    }
    seen[id] |= s === 0 ? 1 : 2;
    (s === 0 ? firstVal : secondVal)[id] = value(r);
  }
  const first = new Float64Array(ids);
  const second = new Float64Array(ids);
  let pairs = 0;
  let missingValue = 0;
  const unmatched: string[] = [];
  for (let id = 0; id < ids; id++) {
    if (seen[id] !== 3) {
      if (seen[id] !== 0) unmatched.push(idCol.level(id));
      continue;
    }
    const x = firstVal[id];
    const y = secondVal[id];
    if (x === x && y === y) {
      first[pairs] = x;
      second[pairs] = y;
      pairs++;
    } else missingValue++;
  }
  const [l1, l2] = [cond.level(lv.first), cond.level(lv.second)];
  if (otherLevel > 0) {
    notes.push(`${otherLevel} row${otherLevel === 1 ? '' : 's'} with another condition (${listLevels(cond, [lv.first, lv.second])}) left out`);
  }
  if (noCondition > 0) notes.push(`${noCondition} row${noCondition === 1 ? '' : 's'} without a condition dropped`);
  if (noId > 0) notes.push(`${noId} row${noId === 1 ? '' : 's'} without an id dropped`);
  if (missingValue > 0) notes.push(`${missingValue} pair${missingValue === 1 ? '' : 's'} with a missing value dropped whole`);
  if (unmatched.length > 0) {
    const shown = unmatched.slice(0, 10).map((u) => `'${u}'`).join(', ');
    warnings.push(
      `${unmatched.length} unmatched id${unmatched.length === 1 ? '' : 's'} (measured under only one of '${l1}' and '${l2}'), dropped: ${shown}${unmatched.length > 10 ? ', ...' : ''}`,
    );
  }
  if (pairs === 0) {
    throw new InputError(`${table.file}: no complete pairs: no id has a value under both '${l1}' and '${l2}' in column '${m.condition}'`);
  }
  notes.push(`pairs joined by '${m.id}': '${l1}' rows against '${l2}' rows`);
  return {
    input: { kind: 'paired', first: toArray(first, pairs), second: toArray(second, pairs) },
    layout: 'long',
    sides: { first: l1, second: l2 },
    counts: { rows: table.rows, pairs, dropped: unmatched.length + missingValue + noId + noCondition },
    notes,
    warnings,
  };
}
