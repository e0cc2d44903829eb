/**
 * Independent data, in either of two layouts: a group column beside a value column (`groups`),
 * or each group in its own column, of possibly different lengths (`columns`). Missing values are
 * dropped one by one (there are no pairs to keep whole) and counted.
 *
 * With an id column, an id that occurs twice is refused: two measurements of one unit are not two
 * independent observations, and treating them as such (pseudo-replication) makes the interval too
 * narrow and the p-value too small.
 */
import { InputError } from '../errors.js';
import { listLevels, repeatedIds, twoLevels } from './levels.js';
import type { LayoutOf, OutcomeSpec, PreparedData, Table } from './types.js';
import { category, column, toArray, valueReaders } from './values.js';

type Groups = LayoutOf<'groups'>;
type Columns = LayoutOf<'columns'>;

const PSEUDO =
  'in independent groups each unit is measured once; a repeated id means one unit was measured more than once (pseudo-replication), ' +
  'which makes the interval too narrow: average each unit\'s measurements first, or treat the design as paired or clustered';

export function prepareGroups(table: Table, m: Groups, outcome: OutcomeSpec): PreparedData {
  const notes: string[] = [];
  const group = category(table, m.group);
  const lv = twoLevels(group, m.firstLevel, m.secondLevel, table.file);
  if (lv.note) notes.push(lv.note);
  if (m.id !== undefined) {
    const idCol = category(table, m.id);
    repeatedIds(table, idCol, (r) => idCol.codes[r], idCol.levelCount, PSEUDO, (k) => `id '${idCol.level(k)}' appears`);
  }
  const [value] = valueReaders(table, [m.value], outcome);
  const a = new Float64Array(table.rows);
  const b = new Float64Array(table.rows);
  let na = 0;
  let nb = 0;
  let missing = 0;
  let other = 0;
  let noGroup = 0;
  for (let r = 0; r < table.rows; r++) {
    const g = group.codes[r];
    if (g < 0) {
      noGroup++;
      continue;
    }
    if (g !== lv.first && g !== lv.second) {
      other++;
      continue;
    }
    const v = value(r);
    if (v !== v) missing++;
    else if (g === lv.first) a[na++] = v;
    else b[nb++] = v;
  }
  const [l1, l2] = [group.level(lv.first), group.level(lv.second)];
  if (other > 0) {
    notes.push(`${other} row${other === 1 ? '' : 's'} of other groups (${listLevels(group, [lv.first, lv.second])}) left out`);
  }
  if (noGroup > 0) notes.push(`${noGroup} row${noGroup === 1 ? '' : 's'} without a group dropped`);
  if (missing > 0) notes.push(`${missing} missing value${missing === 1 ? '' : 's'} dropped`);
  notes.push(`groups from '${m.group}': '${l1}' (first) and '${l2}' (second)`);
  return finish(table, 'groups', l1, l2, a, na, b, nb, missing + noGroup, notes);
}

export function prepareColumns(table: Table, m: Columns, outcome: OutcomeSpec): PreparedData {
  const notes: string[] = [];
  const [ra, rb] = valueReaders(table, [m.first, m.second], outcome);
  const a = new Float64Array(table.rows);
  const b = new Float64Array(table.rows);
  let na = 0;
  let nb = 0;
  let lastA = -1;
  let lastB = -1;
  for (let r = 0; r < table.rows; r++) {
    const x = ra(r);
    const y = rb(r);
    if (x === x) {
      a[na++] = x;
      lastA = r;
    }
    if (y === y) {
      b[nb++] = y;
      lastB = r;
    }
  }
  // Blank cells below the end of a shorter column are not missing values, just a shorter list.
  const gaps = lastA + 1 - na + (lastB + 1 - nb);
  if (gaps > 0) notes.push(`${gaps} missing value${gaps === 1 ? '' : 's'} inside the columns dropped`);
  if (na !== nb) notes.push(`columns of different lengths: '${m.first}' ${na} values, '${m.second}' ${nb} values`);
  notes.push(`'${column(table, m.first).name}' is the first group, '${column(table, m.second).name}' the second; rows are not pairs`);
  return finish(table, 'columns', m.first, m.second, a, na, b, nb, gaps, notes);
}

function finish(table: Table, layout: string, l1: string, l2: string, a: Float64Array, na: number, b: Float64Array, nb: number, dropped: number, notes: string[]): PreparedData {
  if (na === 0 || nb === 0) {
    const empty = na === 0 ? l1 : l2;
    throw new InputError(`${table.file}: the group '${empty}' has no values to analyse (first ${na}, second ${nb})`);
  }
  return {
    input: { kind: 'independent', first: toArray(a, na), second: toArray(b, nb) },
    layout,
    sides: { first: l1, second: l2 },
    counts: { rows: table.rows, first: na, second: nb, dropped },
    notes,
    warnings: [],
  };
}
