/**
 * Forming pairs, groups and crossover subjects from a table: joins by id, dropped and counted
 * incomplete pairs, repeated and unmatched ids, levels, binary outcomes, and the quick-mode
 * column options. All data are invented.
 */
import { describe, expect, it } from 'vitest';
import { columnRequests, prepare, checkLayout } from '../../src/data/prepare.js';
import { quickLayout } from '../../src/data/quick-layout.js';
import { readTableFromText } from '../../src/data/read.js';
import type { LayoutSpec, OutcomeSpec, PreparedData } from '../../src/data/types.js';
import { inputError } from '../helpers/errors.js';

const numeric: OutcomeSpec = { binary: false };

function run(text: string, m: LayoutSpec, outcome: OutcomeSpec = numeric): PreparedData {
  return prepare(readTableFromText(text, 'data.csv', columnRequests(m, outcome)), m, outcome);
}

const wide = (extra: Partial<Extract<LayoutSpec, { layout: 'wide' }>> = {}): LayoutSpec => ({ layout: 'wide', first: 'before_mm', second: 'after_mm', id: 'panel', pairBy: 'id', ...extra });

describe('wide paired layout', () => {
  it('pairs the two values of each row, identified by id', () => {
    const p = run('panel,before_mm,after_mm\nD1,4.1,3.9\nD2,5.0,4.4\nD3,3.8,3.9\n', wide());
    expect(p.input).toEqual({ kind: 'paired', first: [4.1, 5.0, 3.8], second: [3.9, 4.4, 3.9] });
    expect(p.counts).toEqual({ rows: 3, pairs: 3, dropped: 0 });
    expect(p.sides).toEqual({ first: 'before_mm', second: 'after_mm' });
  });

  it('drops incomplete pairs whole, counts them, and states unequal counts', () => {
    const p = run('panel,before_mm,after_mm\nD1,4.1,3.9\nD2,,4.4\nD3,3.8,NA\nD4,4.4,4.0\nD5,5.1,\n', wide());
    expect(p.input).toEqual({ kind: 'paired', first: [4.1, 4.4], second: [3.9, 4.0] });
    expect(p.counts).toEqual({ rows: 5, pairs: 2, dropped: 3 });
    expect(p.notes.join(' ')).toMatch(/3 incomplete pairs dropped whole \(2 with only 'before_mm', 1 with only 'after_mm'\)/);
    expect(p.warnings.join(' ')).toMatch(/unequal counts: 'before_mm' has 4 values and 'after_mm' has 3/);
  });

  it('refuses a repeated id, naming both lines', () => {
    const e = inputError(() => run('panel,before_mm,after_mm\nD1,4.1,3.9\nD2,5.0,4.4\nD1,3.8,3.9\n', wide()));
    expect(e.message).toMatch(/1 repeated id in column 'panel'/);
    expect(e.problems[0]).toMatchObject({ line: 4, col: 1, message: "id 'D1' appears again (first on line 2)" });
  });

  it('pairs by row order only when told, and asks for an id otherwise', () => {
    const text = 'before_mm,after_mm\n4.1,3.9\n5.0,4.4\n';
    expect(inputError(() => run(text, { layout: 'wide', first: 'before_mm', second: 'after_mm', pairBy: 'id' })).message).toMatch(/--pair-by-row-order/);
    const p = run(text, { layout: 'wide', first: 'before_mm', second: 'after_mm', pairBy: 'row-order' });
    expect(p.counts.pairs).toBe(2);
    expect(p.notes.join(' ')).toMatch(/pairs formed by row/);
  });

  it('warns when, paired by row order, one column simply ends early', () => {
    const text = 'before_mm,after_mm\n4.1,3.9\n5.0,4.4\n3.8,\n4.6,\n';
    const p = run(text, { layout: 'wide', first: 'before_mm', second: 'after_mm', pairBy: 'row-order' });
    expect(p.counts).toEqual({ rows: 4, pairs: 2, dropped: 2 });
    expect(p.warnings.join(' ')).toMatch(/shorter column simply ends early/);
  });

  it('says so when no pair is complete', () => {
    expect(inputError(() => run('panel,before_mm,after_mm\nD1,4.1,\nD2,,4.4\n', wide())).message).toMatch(/no complete pairs/);
  });
});

describe('long paired layout', () => {
  const long: LayoutSpec = { layout: 'long', id: 'tile', condition: 'gauge', value: 'um', firstLevel: 'A', secondLevel: 'B' };

  it('joins pairs by id whatever the row order', () => {
    const p = run('tile,gauge,um\nT2,B,20\nT1,A,11\nT2,A,21\nT1,B,10\n', long);
    expect(p.input).toEqual({ kind: 'paired', first: [21, 11], second: [20, 10] });
    expect(p.sides).toEqual({ first: 'A', second: 'B' });
  });

  it('names unmatched ids, drops them, and counts them', () => {
    const p = run('tile,gauge,um\nT1,A,11\nT1,B,10\nT2,A,21\nT3,B,30\n', long);
    expect(p.counts).toEqual({ rows: 4, pairs: 1, dropped: 2 });
    expect(p.warnings[0]).toMatch(/2 unmatched ids .* 'T2', 'T3'/);
  });

  it('refuses the same id twice under one condition', () => {
    const e = inputError(() => run('tile,gauge,um\nT1,A,11\nT1,B,10\nT1,A,12\n', long));
    expect(e.problems[0]).toMatchObject({ line: 4, message: "id 'T1' with condition 'A' appears again (first on line 2)" });
  });

  it('leaves out other conditions with a note, and defaults levels in order of appearance', () => {
    const p = run('tile,gauge,um\nT1,A,11\nT1,C,9\nT1,B,10\n', long);
    expect(p.notes.join(' ')).toMatch(/1 row with another condition \('C'\) left out/);
    const d = run('tile,gauge,um\nT1,B,11\nT1,A,10\n', { ...long, firstLevel: undefined, secondLevel: undefined });
    expect(d.sides).toEqual({ first: 'B', second: 'A' });
    expect(d.notes[0]).toMatch(/taking 'B' as first and 'A' as second, in order of appearance/);
  });

  it('lists the levels when a named level is absent or there are more than two', () => {
    expect(inputError(() => run('tile,gauge,um\nT1,A,11\nT1,B,10\n', { ...long, firstLevel: 'a' })).message).toMatch(/'a' does not occur .* 'A', 'B'/);
    const three = 'tile,gauge,um\nT1,A,1\nT1,B,2\nT1,C,3\n';
    expect(inputError(() => run(three, { ...long, firstLevel: undefined, secondLevel: undefined })).message).toMatch(/3 distinct values .*--first-level/);
  });
});

describe('independent layouts', () => {
  const groups: LayoutSpec = { layout: 'groups', group: 'feed', value: 'gain_kg' };

  it('splits a value column by a group column, dropping and counting missing values', () => {
    const p = run('hive,feed,gain_kg\nH1,syrup,3.4\nH2,fondant,2.1\nH3,syrup,NA\nH4,fondant,2.6\nH5,,3.0\n', groups);
    expect(p.input).toEqual({ kind: 'independent', first: [3.4], second: [2.1, 2.6] });
    expect(p.counts).toEqual({ rows: 5, first: 1, second: 2, dropped: 2 });
  });

  it('refuses a repeated id in independent groups as pseudo-replication', () => {
    const e = inputError(() => run('hive,feed,gain_kg\nH1,syrup,3.4\nH2,fondant,2.1\nH1,syrup,3.9\n', { ...groups, id: 'hive' }));
    expect(e.message).toMatch(/pseudo-replication/);
    expect(e.problems[0]).toMatchObject({ line: 4 });
  });

  it('says which group is empty', () => {
    expect(inputError(() => run('hive,feed,gain_kg\nH1,syrup,3.4\nH2,fondant,NA\n', groups)).message).toMatch(/'fondant' has no values/);
  });

  it('reads two columns of different lengths', () => {
    const p = run('syrup_kg,fondant_kg\n3.4,2.1\n4.0,\n,2.6\n2.9,\n', { layout: 'columns', first: 'syrup_kg', second: 'fondant_kg' });
    expect(p.input).toEqual({ kind: 'independent', first: [3.4, 4.0, 2.9], second: [2.1, 2.6] });
    expect(p.counts.dropped).toBe(2);
    expect(p.notes.join(' ')).toMatch(/different lengths/);
  });
});

describe('crossover layout', () => {
  const cx: LayoutSpec = { layout: 'crossover', id: 'crew', sequence: 'seq', period1: 'w1', period2: 'w2', firstThenSecond: 'NO' };
  const text = 'crew,seq,w1,w2\nC1,NO,41,44\nC2,ON,44,40\nC3,NO,38,NA\nC4,ON,45,43\nC5,NO,40,42\n';

  it('splits subjects by sequence and drops incomplete ones', () => {
    const p = run(text, cx);
    expect(p.input).toEqual({ kind: 'crossover', firstThenSecond: { period1: [41, 40], period2: [44, 42] }, secondThenFirst: { period1: [44, 45], period2: [40, 43] } });
    expect(p.counts).toMatchObject({ pairs: 4, first: 2, second: 2, dropped: 1 });
  });

  it('does not guess which sequence took the first condition first', () => {
    expect(inputError(() => run(text, { ...cx, firstThenSecond: undefined })).message).toMatch(/does not guess/);
  });

  it('refuses a third sequence', () => {
    expect(inputError(() => run(text + 'C6,XX,40,41\n', cx)).message).toMatch(/3 distinct values|3 sequences/);
  });
});

describe('binary outcomes', () => {
  const m: LayoutSpec = { layout: 'wide', first: 'p', second: 'q', pairBy: 'row-order' };

  it('maps yes/no, true/false and 0/1 without help, in any letter case', () => {
    expect(run('p,q\nyes,no\nNo,YES\n', m, { binary: true }).input).toEqual({ kind: 'paired', first: [1, 0], second: [0, 1] });
    expect(run('p,q\ntrue,false\n', m, { binary: true }).input).toEqual({ kind: 'paired', first: [1], second: [0] });
    expect(run('p,q\n1,0\n0,0\n', m, { binary: true }).input).toEqual({ kind: 'paired', first: [1, 0], second: [0, 0] });
  });

  it('takes an explicit event value, and asks for one otherwise', () => {
    expect(run('p,q\npass,fail\nfail,fail\n', m, { binary: true, event: 'fail' }).input).toEqual({ kind: 'paired', first: [0, 1], second: [1, 1] });
    expect(inputError(() => run('p,q\npass,fail\n', m, { binary: true })).message).toMatch(/cannot tell which value is the event/);
    expect(inputError(() => run('p,q\npass,fail\n', m, { binary: true, event: 'Pass' })).message).toMatch(/does not occur/);
    expect(inputError(() => run('p,q\na,b\nc,a\n', m, { binary: true })).message).toMatch(/found 3/);
  });
});

describe('quick-mode columns', () => {
  it('picks the layout from the options the design allows', () => {
    expect(quickLayout('paired', 'paired-t', { first: 'a', second: 'b', id: 'u' })).toMatchObject({ layout: 'wide', pairBy: 'id' });
    expect(quickLayout('paired', 'paired-t', { first: 'a', second: 'b', pairByRowOrder: true })).toMatchObject({ layout: 'wide', pairBy: 'row-order' });
    expect(quickLayout('paired', 'paired-t', { id: 'u', condition: 'c', value: 'v' })).toMatchObject({ layout: 'long' });
    expect(quickLayout('independent', 'welch-t', { group: 'g', value: 'v' })).toMatchObject({ layout: 'groups' });
    expect(quickLayout('independent', 'welch-t', { first: 'a', second: 'b' })).toMatchObject({ layout: 'columns' });
    expect(quickLayout('crossover', 'crossover-t', { sequence: 's', period1: 'p', period2: 'q', firstThenSecond: 'AB' })).toMatchObject({ layout: 'crossover' });
  });

  it('names missing and misplaced options, and shows the other way to give columns', () => {
    const e = inputError(() => quickLayout('paired', 'paired-t', { first: 'a', group: 'g' }));
    expect(e.message).toMatch(/missing --second; --group does not fit/);
    expect(e.message).toMatch(/or: --id ID --condition C --value V/);
    expect(inputError(() => quickLayout('independent', 'welch-t', { first: 'a', second: 'b', id: 'u' })).message).toMatch(/--id does not fit/);
  });

  it('refuses a layout that cannot hold the design of the procedure', () => {
    expect(() => checkLayout('paired', 'groups', 'paired-t')).toThrow(/needs paired data \(layout wide or long\)/);
  });
});
