/**
 * Paired data, one row per unit: the unit's two values sit on one row. With an id column, each
 * id must occur once (a repeat would count one unit twice); without one, the user has said that
 * each row is one unit (pairing by row order). A row with either value missing is an incomplete
 * pair and is dropped whole, and counted.
 */
import { InputError } from '../errors.js';
import { repeatedIds } from './levels.js';
import type { CategoryColumn, LayoutOf, OutcomeSpec, PreparedData, Table } from './types.js';
import { category, column, numberArray, truncate, valueReaders } from './values.js';

type Wide = LayoutOf<'wide'>;

export function prepareWide(table: Table, m: Wide, outcome: OutcomeSpec): PreparedData {
  const notes: string[] = [];
  const warnings: string[] = [];
  if (m.pairBy === 'id' && m.id === undefined) {
    throw new InputError(
      `pairing by id needs an id column: give --id COLUMN, or --pair-by-row-order if each row holds the two measurements of one unit`,
    );
  }
  const idCol = m.id !== undefined ? category(table, m.id) : undefined;
  if (idCol) {
    repeatedIds(table, idCol, (r) => idCol.codes[r], idCol.levelCount,
      'each unit must appear on one row (its two measurements side by side); a repeat would count one unit twice',
      (k) => `id '${idCol.level(k)}' appears`);
  }
  const n = table.rows;
  const direct = complete(table, m, outcome, idCol);
  if (direct) {
    // Nothing to drop: the columns as read are the pairs (no copy of a million-row column).
    return {
      input: { kind: 'paired', first: direct[0], second: direct[1] },
      layout: 'wide',
      sides: { first: m.first, second: m.second },
      counts: { rows: n, pairs: n, dropped: 0 },
      notes: [pairingNote(m)],
      warnings,
    };
  }
  const [a, b] = valueReaders(table, [m.first, m.second], outcome);
  const first = numberArray(n);
  const second = numberArray(n);
  let pairs = 0;
  let noId = 0;
  let onlyFirst = 0;
  let onlySecond = 0;
  let neither = 0;
  let lastFirst = -1;
  let lastSecond = -1;
  let firstIncomplete = -1;
  for (let r = 0; r < n; r++) {
    const x = a(r);
    const y = b(r);
    if (x === x) lastFirst = r;
    if (y === y) lastSecond = r;
    if (idCol && idCol.codes[r] < 0) {
      noId++;
      continue;
    }
    if (x === x && y === y) {
      first[pairs] = x;
      second[pairs] = y;
      pairs++;
    } else if (x === x || y === y) {
      if (firstIncomplete < 0) firstIncomplete = r;
      if (x === x) onlyFirst++;
      else onlySecond++;
    } else neither++;
  }
  const dropped = noId + onlyFirst + onlySecond + neither;
  if (noId > 0) notes.push(`${noId} row${noId === 1 ? '' : 's'} without an id dropped`);
  if (onlyFirst + onlySecond > 0) {
    notes.push(
      `${onlyFirst + onlySecond} incomplete pair${onlyFirst + onlySecond === 1 ? '' : 's'} dropped whole ` +
        `(${onlyFirst} with only '${m.first}', ${onlySecond} with only '${m.second}')`,
    );
    const nFirst = pairs + onlyFirst;
    const nSecond = pairs + onlySecond;
    if (nFirst !== nSecond) {
      warnings.push(`unequal counts: '${m.first}' has ${nFirst} values and '${m.second}' has ${nSecond}; only the ${pairs} complete pairs are analysed`);
    }
    if (m.pairBy === 'row-order' && (onlyFirst === 0 || onlySecond === 0) && firstIncomplete > Math.min(lastFirst, lastSecond)) {
      warnings.push(
        `the shorter column simply ends early: if '${m.first}' and '${m.second}' are two separate lists rather than two measurements of the same units, the data are not paired`,
      );
    }
  }
  if (neither > 0) notes.push(`${neither} row${neither === 1 ? '' : 's'} with both values missing skipped`);
  if (pairs === 0) {
    throw new InputError(`${table.file}: no complete pairs: every row misses '${m.first}' or '${m.second}' (${table.rows} rows read)`);
  }
  notes.push(pairingNote(m));
  return {
    input: { kind: 'paired', first: truncate(first, pairs), second: truncate(second, pairs) },
    layout: 'wide',
    sides: { first: m.first, second: m.second },
    counts: { rows: table.rows, pairs, dropped },
    notes,
    warnings,
  };
}

function pairingNote(m: Wide): string {
  return m.pairBy === 'row-order' ? 'pairs formed by row: each row is taken as one unit, as requested' : `pairs identified by '${m.id}', one row per unit`;
}

/** The two numeric columns themselves when no row misses a value or an id; else null. */
function complete(table: Table, m: Wide, outcome: OutcomeSpec, idCol: CategoryColumn | undefined): [number[], number[]] | null {
  if (outcome.binary) return null;
  const a = column(table, m.first);
  const b = column(table, m.second);
  if (a.kind !== 'number' || b.kind !== 'number' || a.missing > 0 || b.missing > 0 || (idCol && idCol.missing > 0)) return null;
  return [a.values, b.values];
}
