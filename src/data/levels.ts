/**
 * Choosing the two levels of a group or condition column, and checking ids, for the layouts.
 */
import { InputError } from '../errors.js';
import type { Problem } from '../problems.js';
import type { CategoryColumn, Table } from './types.js';

export interface TwoLevels {
  first: number;
  second: number;
  /** How the levels were chosen, when not named by the user. */
  note?: string;
}

/**
 * The codes of the first and second level. Named levels must occur; unnamed ones default to the
 * two distinct values in order of appearance (and the choice is stated), provided there are two.
 */
export function twoLevels(col: CategoryColumn, firstName: string | undefined, secondName: string | undefined, file: string): TwoLevels {
  const found = listLevels(col) || 'none';
  const find = (name: string, which: string): number => {
    const i = col.find(name);
    if (i === -1) {
      throw new InputError(`${file}: the ${which} level '${name}' does not occur in column '${col.name}'; its values are ${found}`);
    }
    return i;
  };
  if (firstName !== undefined && secondName !== undefined) {
    if (firstName === secondName) throw new InputError(`the first and second levels are both '${firstName}'; name two different values of '${col.name}'`);
    return { first: find(firstName, 'first'), second: find(secondName, 'second') };
  }
  if (firstName !== undefined || secondName !== undefined) {
    const named = firstName ?? secondName!;
    const i = find(named, firstName !== undefined ? 'first' : 'second');
    if (col.levelCount !== 2) {
      throw new InputError(`${file}: column '${col.name}' has the values ${found}; name both levels (--first-level and --second-level)`);
    }
    const j = 1 - i;
    return firstName !== undefined ? { first: i, second: j } : { first: j, second: i };
  }
  if (col.levelCount !== 2) {
    throw new InputError(
      `${file}: column '${col.name}' has ${col.levelCount} distinct value${col.levelCount === 1 ? '' : 's'} (${found}); ` +
        (col.levelCount < 2 ? 'a comparison needs two' : 'name the two to compare with --first-level and --second-level'),
    );
  }
  return {
    first: 0,
    second: 1,
    note: `levels of '${col.name}' not named: taking '${col.level(0)}' as first and '${col.level(1)}' as second, in order of appearance`,
  };
}

/**
 * Ids that occur more than once (by the given key per row, -1 = ignore), as problems with their
 * lines. `why` says what a repeat means for this design. Seen keys are kept as bits (a million ids
 * take 125 kB); the earlier line of a repeat is looked up only for the few repeats reported.
 */
export function repeatedIds(table: Table, idCol: CategoryColumn, key: (row: number) => number, keys: number, why: string, label: (k: number) => string): void {
  const seen = new Uint8Array((keys >> 3) + 1);
  const problems: Problem[] = [];
  let count = 0;
  for (let r = 0; r < table.rows; r++) {
    const k = key(r);
    if (k < 0) continue;
    const bit = 1 << (k & 7);
    if ((seen[k >> 3] & bit) === 0) {
      seen[k >> 3] |= bit;
      continue;
    }
    count++;
    if (problems.length < 10) {
      let first = 0;
      while (key(first) !== k) first++;
      problems.push({
        code: 'duplicate-id',
        file: table.file,
        line: table.lineOf(r),
        col: idCol.index + 1,
        message: `${label(k)} again (first on line ${table.lineOf(first)})`,
      });
    }
  }
  if (count > 0) {
    if (count > problems.length) problems.push({ code: 'duplicate-id', file: table.file, message: `and ${count - problems.length} more repeats` });
    throw new InputError(`${table.file}: ${count} repeated id${count === 1 ? '' : 's'} in column '${idCol.name}': ${why}`, problems);
  }
}

/** The values of a small text column, quoted, in order of appearance (at most 12, then "..."). */
export function listLevels(col: CategoryColumn, except: number[] = []): string {
  const out: string[] = [];
  for (let c = 0; c < col.levelCount && out.length < 12; c++) if (!except.includes(c)) out.push(`'${col.level(c)}'`);
  const more = col.levelCount - except.length > out.length ? ', ...' : '';
  return out.join(', ') + more;
}
