/**
 * CSV reading. Every input that the plain scan can read is read by BOTH readers (the plain scan
 * and papaparse) and the two tables must be identical: same header, delimiter, rows, line numbers,
 * values and codes, same problems. Files with quotes go to papaparse only (the scan refuses them).
 * All data here are invented.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { mkdtempSync, writeFileSync, mkdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { InputError } from '../../src/errors.js';
import { readTable, readTableFromText } from '../../src/data/read.js';
import type { ColumnRequest, ReadOptions, Table } from '../../src/data/types.js';
import { inputError } from '../helpers/errors.js';

const num = (name: string): ColumnRequest => ({ name, kind: 'number', role: name });
const txt = (name: string): ColumnRequest => ({ name, kind: 'category', role: name });

/** A table as plain data, for comparing the two readers. */
function plain(t: Table): unknown {
  const cols: Record<string, unknown> = {};
  for (const [k, c] of Object.entries(t.columns)) {
    cols[k] =
      c.kind === 'number'
        ? { kind: c.kind, index: c.index, missing: c.missing, values: [...c.values].map((v) => (Number.isNaN(v) ? 'NaN' : Object.is(v, -0) ? '-0' : v)) }
        : { kind: c.kind, index: c.index, missing: c.missing, codes: [...c.codes], levels: Array.from({ length: c.levelCount }, (_, i) => c.level(i)) };
  }
  return { header: t.header, delimiter: t.delimiter, rows: t.rows, lines: Array.from({ length: t.rows }, (_, r) => t.lineOf(r)), cols };
}

function problemsOf(f: () => unknown): unknown {
  try {
    f();
  } catch (e) {
    if (e instanceof InputError) return { message: e.message, problems: e.problems };
    throw e;
  }
  return null;
}

/** Reads with both readers; they must agree (in the table, or in the error). Returns the table. */
function both(text: string, requests: ColumnRequest[], opts: ReadOptions = {}): Table {
  const fast = problemsOf(() => readTableFromText(text, 'data.csv', requests, { ...opts, parser: 'fast' }));
  const full = problemsOf(() => readTableFromText(text, 'data.csv', requests, { ...opts, parser: 'full' }));
  expect(full).toEqual(fast);
  if (fast) throw Object.assign(new InputError((fast as { message: string }).message, (fast as { problems: [] }).problems));
  const a = readTableFromText(text, 'data.csv', requests, { ...opts, parser: 'fast' });
  const b = readTableFromText(text, 'data.csv', requests, { ...opts, parser: 'full' });
  expect(a.parser).toBe('fast');
  expect(b.parser).toBe('full');
  expect(plain(b)).toEqual(plain(a));
  return a;
}

const KILN = 'tile,gauge_a_um,gauge_b_um\nT01,212.4,209.8\nT02,198.7,197.9\nT03,225.1,221.6\n';

describe('reading CSV: both readers agree', () => {
  it('reads only the requested columns, as numbers or codes', () => {
    const t = both(KILN, [txt('tile'), num('gauge_b_um')]);
    expect(t.rows).toBe(3);
    expect(Object.keys(t.columns).sort()).toEqual(['gauge_b_um', 'tile']);
    const b = t.columns.gauge_b_um;
    expect(b.kind === 'number' && [...b.values]).toEqual([209.8, 197.9, 221.6]);
    const id = t.columns.tile;
    expect(id.kind === 'category' && [...id.codes]).toEqual([0, 1, 2]);
    expect(id.kind === 'category' && id.level(2)).toBe('T03');
    expect(t.lineOf(0)).toBe(2);
  });

  it('handles CRLF line ends and a byte-order mark', () => {
    const text = '\ufeff' + KILN.replace(/\n/g, '\r\n');
    const t = both(text, [txt('tile'), num('gauge_a_um')]);
    expect(t.header).toEqual(['tile', 'gauge_a_um', 'gauge_b_um']);
    const a = t.columns.gauge_a_um;
    expect(a.kind === 'number' && [...a.values]).toEqual([212.4, 198.7, 225.1]);
  });

  it('detects comma, semicolon and tab from the header line, and takes an override', () => {
    for (const [d, name] of [[',', ','], [';', ';'], ['\t', '\t']] as const) {
      const text = KILN.replace(/,/g, d);
      expect(both(text, [num('gauge_a_um')]).delimiter).toBe(name);
    }
    const semicolons = 'plot;yield_kg\nP1;12.5\n';
    expect(both(semicolons, [num('yield_kg')], { delimiter: ';' }).delimiter).toBe(';');
    // Forcing a comma on a semicolon file leaves one column named 'plot;yield_kg'.
    const e = inputError(() => both(semicolons, [num('yield_kg')], { delimiter: ',' }));
    expect(e.problems[0].hint).toMatch(/'plot;yield_kg'/);
  });

  it('asks for --delimiter when the header is ambiguous', () => {
    const e = inputError(() => both('a,b;c\n1,2;3\n', [num('a')]));
    expect(e.message).toMatch(/cannot tell the delimiter/);
    expect(e.problems[0].hint).toMatch(/--delimiter/);
  });

  it('treats empty cells and NA as missing by default, and configured markers otherwise', () => {
    const text = 'hive,gain_kg\nH1,3.4\nH2,\nH3,NA\nH4, 2.9 \n';
    const t = both(text, [num('gain_kg')]);
    const g = t.columns.gain_kg;
    expect(g.kind === 'number' && g.missing).toBe(2);
    expect(g.kind === 'number' && [...g.values].map((v) => (Number.isNaN(v) ? null : v))).toEqual([3.4, null, null, 2.9]);
    const custom = 'hive,gain_kg\nH1,3.4\nH2,.\nH3,-99\nH4,\n';
    const c = both(custom, [num('gain_kg')], { missing: ['.', '-99'] }).columns.gain_kg;
    expect(c.kind === 'number' && c.missing).toBe(3);
    // NA is no longer a marker once the list is replaced:
    const e = inputError(() => both('hive,gain_kg\nH1,NA\n', [num('gain_kg')], { missing: ['.'] }));
    expect(e.problems[0]).toMatchObject({ line: 2, col: 2 });
  });

  it('treats missing markers in text columns as missing too', () => {
    const t = both('hive,feed\nH1,syrup\nH2,NA\nH3,\nH4, syrup \n', [txt('feed')]);
    const f = t.columns.feed;
    expect(f.kind === 'category' && [...f.codes]).toEqual([0, -1, -1, 0]);
  });

  it('skips blank lines and keeps line numbers true to the file', () => {
    const text = 'tile,thick\n\nT1,1.5\n   \nT2,2.5\n\n';
    const t = both(text, [num('thick')]);
    expect(t.rows).toBe(2);
    expect([t.lineOf(0), t.lineOf(1)]).toEqual([3, 5]);
  });

  it('reports a non-numeric value with its line and column, and lists every problem', () => {
    const text = 'tile,a,b\nT1,1.5,2\nT2,thick,3\nT3,4,NaN\nT4,5,Infinity\n';
    const e = inputError(() => both(text, [num('a'), num('b')]));
    expect(e.message).toMatch(/3 problems/);
    expect(e.problems.map((p) => [p.line, p.col])).toEqual([
      [3, 2],
      [4, 3],
      [5, 3],
    ]);
    expect(e.problems[0].message).toMatch(/'thick' is not a number \(column 'a', field 2\)/);
    expect(e.problems[1].message).toMatch(/'NaN' is not a measurement/);
  });

  it('lists the columns that exist when a name is unknown, and suggests a near one', () => {
    const e = inputError(() => both(KILN, [num('Gauge_A_um'), num('depth')]));
    expect(e.problems).toHaveLength(2);
    expect(e.problems[0].hint).toMatch(/did you mean 'gauge_a_um'/);
    expect(e.problems[1].hint).toMatch(/the columns are 'tile', 'gauge_a_um', 'gauge_b_um'/);
  });

  it('refuses a column name that appears twice in the header', () => {
    const e = inputError(() => both('a,b,a\n1,2,3\n', [num('a')]));
    expect(e.problems[0].message).toMatch(/appears 2 times/);
  });

  it('reports rows with the wrong number of fields', () => {
    const e = inputError(() => both('a,b,c\n1,2,3\n4,5\n6,7,8,9\n', [num('a')]));
    expect(e.problems.map((p) => p.line)).toEqual([3, 4]);
    expect(e.problems[0].message).toMatch(/2 fields; the header has 3/);
  });

  it('says so for an empty file and for a header without rows', () => {
    expect(inputError(() => both('', [num('a')])).message).toMatch(/is empty/);
    expect(inputError(() => both('\n\n', [num('a')])).message).toMatch(/is empty/);
    expect(inputError(() => both('a,b\n', [num('a')])).message).toMatch(/no data rows/);
  });

  it('refuses one column named for two roles', () => {
    expect(inputError(() => both(KILN, [num('gauge_a_um'), txt('gauge_a_um')])).message).toMatch(/both the/);
  });

  it('interns non-ASCII text identically in both readers', () => {
    const t = both('site,ph\nNørdal,6.5\nÅsen,7.1\nNørdal,6.9\n', [txt('site'), num('ph')]);
    const s = t.columns.site;
    expect(s.kind === 'category' && [s.level(0), s.level(1), [...s.codes]]).toEqual(['Nørdal', 'Åsen', [0, 1, 0]]);
    expect(s.kind === 'category' && s.find('Åsen')).toBe(1);
  });

  it('agree on random unquoted files (property)', () => {
    const cell = fc.oneof(
      fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e6, max: 1e6 }).map((x) => String(x)),
      fc.integer({ min: -999, max: 999 }).map(String),
      fc.constantFrom('', 'NA', ' 3.5 ', '1e-3', '.5', 'x', '-0', '12,5'),
    );
    const row = fc.tuple(fc.stringMatching(/^[A-Za-z0-9]{1,4}$/), cell, cell);
    fc.assert(
      fc.property(fc.array(row, { minLength: 1, maxLength: 30 }), fc.constantFrom(',', ';', '\t'), fc.constantFrom('\n', '\r\n'), (rows, d, nl) => {
        const text = ['id', 'first', 'second'].join(d) + nl + rows.map((r) => r.map((c) => c.replace(/[,;\t]/g, '')).join(d)).join(nl) + nl;
        try {
          both(text, [txt('id'), num('first'), num('second')]);
        } catch (e) {
          if (!(e instanceof InputError)) throw e;
        }
      }),
      { numRuns: 300 },
    );
  });
});

describe('quoted files go to papaparse', () => {
  it('reads quoted delimiters, doubled quotes and line breaks inside quotes, with true line numbers', () => {
    const text = 'plot;variety;"yield, kg";note\r\n"P1";"Cox";"12.5";"north ""edge"""\r\n"P2";Cox;11.0;"spans\r\ntwo lines"\r\n"P3";"Gala";NA;""\r\n';
    const t = readTableFromText(text, 'orchard.csv', [txt('variety'), num('yield, kg'), txt('note')]);
    expect(t.parser).toBe('full');
    expect(t.delimiter).toBe(';');
    const y = t.columns['yield, kg'];
    expect(y.kind === 'number' && [...y.values].map((v) => (Number.isNaN(v) ? null : v))).toEqual([12.5, 11, null]);
    const n = t.columns.note;
    expect(n.kind === 'category' && n.level(0)).toBe('north "edge"');
    expect(n.kind === 'category' && n.level(1)).toBe('spans\r\ntwo lines');
    expect([t.lineOf(0), t.lineOf(1), t.lineOf(2)]).toEqual([2, 3, 5]);
  });

  it('reports an unclosed quote with its line', () => {
    const e = inputError(() => readTableFromText('a,b\n1,2\n3,"4\n', 'q.csv', [num('a'), num('b')]));
    expect(e.problems[0]).toMatchObject({ line: 3 });
    expect(e.problems[0].message).toMatch(/not closed/);
  });

  it('reads the quoted fixture file (BOM, CRLF, semicolons)', () => {
    const t = readTable(join(import.meta.dirname, '../fixtures/data/orchard-quoted.csv'), [txt('variety'), num('yield, kg')]);
    expect(t.parser).toBe('full');
    expect(t.rows).toBe(7);
    expect(t.header[0]).toBe('plot');
    const y = t.columns['yield, kg'];
    expect(y.kind === 'number' && y.missing).toBe(1);
    expect(t.lineOf(3)).toBe(6);
  });
});

describe('reading files', () => {
  const dir = mkdtempSync(join(tmpdir(), 'tandem-read-'));

  it('gives the same table from a file as from its text, across tiny chunks', () => {
    const lines = ['rack,open_c,closed_c'];
    for (let i = 0; i < 500; i++) lines.push(`rk${i},${(20 + (i % 17) * 0.25).toFixed(2)},${i % 50 === 0 ? 'NA' : (19 + (i % 13) * 0.5).toFixed(1)}`);
    const text = '\ufeff' + lines.join('\r\n') + '\r\n';
    const path = join(dir, 'racks.csv');
    writeFileSync(path, text);
    const req = [txt('rack'), num('open_c'), num('closed_c')];
    const whole = plain(readTableFromText(text, 'x', req));
    for (const chunkSize of [7, 64, 1000, 1 << 16]) {
      expect(plain(readTable(path, req, { chunkSize }))).toEqual(whole);
    }
    expect(plain(readTable(path, req, { parser: 'full' }))).toEqual(whole);
  });

  it('names a missing file, a folder, an empty file and a UTF-16 file', () => {
    expect(inputError(() => readTable(join(dir, 'nope.csv'), [num('a')])).message).toMatch(/not found/);
    mkdirSync(join(dir, 'folder.csv'));
    expect(inputError(() => readTable(join(dir, 'folder.csv'), [num('a')])).message).toMatch(/is a folder/);
    writeFileSync(join(dir, 'empty.csv'), '');
    expect(inputError(() => readTable(join(dir, 'empty.csv'), [num('a')])).message).toMatch(/is empty/);
    writeFileSync(join(dir, 'wide.csv'), Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from('a\n1\n', 'utf16le')]));
    expect(inputError(() => readTable(join(dir, 'wide.csv'), [num('a')])).message).toMatch(/UTF-16/);
  });

  it('falls back to papaparse when a quote appears late in a large file', () => {
    const lines = ['id,v'];
    for (let i = 0; i < 3000; i++) lines.push(`u${i},${i}`);
    lines.push('"u3000","3000"');
    const path = join(dir, 'late-quote.csv');
    writeFileSync(path, lines.join('\n') + '\n');
    const t = readTable(path, [txt('id'), num('v')], { chunkSize: 256 });
    expect(t.parser).toBe('full');
    expect(t.rows).toBe(3001);
    const v = t.columns.v;
    expect(v.kind === 'number' && v.values[3000]).toBe(3000);
  });
});
