/**
 * Materialising only the requested columns while a reader walks the rows. The plain scan hands
 * cells over as bytes (`cellBytes`), papaparse as strings (`cellString`); both read a number with
 * the same exact decimal reading (cells.ts) and intern text through the same bytes (intern.ts),
 * so one file gives the same table whichever reader ran. Numbers go into plain arrays (NaN =
 * missing), text into codes. Problems are collected (up to a limit) and raised together.
 */
import { InputError } from '../errors.js';
import type { Problem } from '../problems.js';
import { fastNumber, fastNumberBytes, hasNumericMarker, readNumberCell } from './cells.js';
import type { Delimiter } from './delimiter.js';
import { isAsciiSpace, LevelPool } from './intern.js';
import { numberArray, truncate } from './values.js';
import { resolveColumns } from './resolve-columns.js';
import type { Column, ColumnRequest, Table } from './types.js';

/** More problems than this are counted, not listed. */
export const MAX_LISTED_PROBLEMS = 20;

interface Slot {
  request: ColumnRequest;
  index: number;
  numbers?: number[];
  codes?: Int32Array;
  pool?: LevelPool;
  missing: number;
}

export class ColumnCollector {
  readonly slots: Slot[];
  readonly fieldCount: number;
  rows = 0;
  /** Line of each row; null while every row sits on the line after the previous one. */
  private lines: Int32Array | null = null;
  private firstLine = 0;
  private capacity = 1024;
  private line = 0;
  private rowOk = true;
  private readonly problems: Problem[] = [];
  private problemCount = 0;
  private readonly useFast: boolean;
  /** Missing markers other than the empty cell, as strings and as UTF-8 bytes. */
  private readonly markerSet: Set<string>;
  private readonly markerBytes: Uint8Array[];

  constructor(
    readonly file: string,
    readonly header: string[],
    requests: ColumnRequest[],
    private readonly missing: ReadonlySet<string>,
  ) {
    this.fieldCount = header.length;
    this.useFast = !hasNumericMarker(missing);
    this.markerSet = new Set([...missing].filter((m) => m !== ''));
    this.markerBytes = [...this.markerSet].map((m) => new TextEncoder().encode(m));
    this.slots = resolveColumns(file, header, requests)
      .map(({ request, index }): Slot => {
        const slot: Slot = { request, index, missing: 0 };
        if (request.kind === 'number') slot.numbers = numberArray(this.capacity);
        else {
          slot.codes = new Int32Array(this.capacity);
          slot.pool = new LevelPool();
        }
        return slot;
      })
      .sort((a, b) => a.index - b.index);
  }

  /** Starts a data row that begins on `line` (1-based). */
  begin(line: number): void {
    if (this.rows === this.capacity) this.grow();
    this.line = line;
    this.rowOk = true;
  }

  /** The cell in bytes `src[start, end)` of slot `k` (slots are in field order): the plain scan. */
  cellBytes(k: number, src: Uint8Array, start: number, end: number): void {
    const slot = this.slots[k];
    const row = this.rows;
    if (slot.numbers) {
      if (start === end) return this.missingNumber(slot, row);
      if (!this.useFast || !fastNumberBytes(src, start, end, slot.numbers, row)) this.slowNumber(slot, row, Buffer.from(src.buffer, src.byteOffset + start, end - start).toString('utf8'));
      return;
    }
    while (start < end && isAsciiSpace(src[start])) start++;
    while (end > start && isAsciiSpace(src[end - 1])) end--;
    if (start === end || this.isMarkerBytes(src, start, end)) {
      slot.codes![row] = -1;
      slot.missing++;
      return;
    }
    slot.codes![row] = slot.pool!.internBytes(src, start, end);
  }

  /** The same cell as a string: papaparse's path. */
  cellString(k: number, text: string): void {
    const slot = this.slots[k];
    const row = this.rows;
    if (slot.numbers) {
      if (text.length === 0) return this.missingNumber(slot, row);
      const quick = this.useFast ? fastNumber(text, 0, text.length) : NaN;
      if (quick === quick) slot.numbers[row] = quick;
      else this.slowNumber(slot, row, text);
      return;
    }
    let start = 0;
    let end = text.length;
    while (start < end && isAsciiSpace(text.charCodeAt(start))) start++;
    while (end > start && isAsciiSpace(text.charCodeAt(end - 1))) end--;
    const s = start === 0 && end === text.length ? text : text.slice(start, end);
    if (s === '' || this.markerSet.has(s)) {
      slot.codes![row] = -1;
      slot.missing++;
      return;
    }
    slot.codes![row] = slot.pool!.internString(s);
  }

  private missingNumber(slot: Slot, row: number): void {
    slot.numbers![row] = NaN;
    slot.missing++;
  }

  private slowNumber(slot: Slot, row: number, text: string): void {
    const r = readNumberCell(text, this.missing);
    if (r.kind === 'value') slot.numbers![row] = r.value;
    else {
      slot.numbers![row] = NaN;
      if (r.kind === 'missing') slot.missing++;
      else this.problem(slot, r.message, r.hint);
    }
  }

  private isMarkerBytes(src: Uint8Array, start: number, end: number): boolean {
    for (const m of this.markerBytes) {
      if (m.length !== end - start) continue;
      let same = true;
      for (let i = 0; i < m.length && same; i++) same = m[i] === src[start + i];
      if (same) return true;
    }
    return false;
  }

  /** The row had `got` fields instead of the header's count: reported, and the row is not kept. */
  wrongFieldCount(got: number): void {
    this.rowOk = false;
    this.add({
      code: 'data',
      file: this.file,
      line: this.line,
      message: `this row has ${got} field${got === 1 ? '' : 's'}; the header has ${this.fieldCount}`,
      hint: 'every row needs one field per header column (an empty field is written as nothing between two delimiters)',
    });
  }

  /** A reader-level problem on the current row (e.g. an unclosed quote); the row is not kept. */
  rowProblem(message: string, hint?: string): void {
    this.rowOk = false;
    this.add({ code: 'data', file: this.file, line: this.line, message, hint });
  }

  end(): void {
    if (!this.rowOk) return;
    if (this.rows === 0) this.firstLine = this.line;
    if (this.lines) this.lines[this.rows] = this.line;
    else if (this.line !== this.firstLine + this.rows) {
      // A blank line or a quoted line break: from here on, lines are kept row by row.
      this.lines = new Int32Array(this.capacity);
      for (let r = 0; r < this.rows; r++) this.lines[r] = this.firstLine + r;
      this.lines[this.rows] = this.line;
    }
    this.rows++;
  }

  /** Every row from papaparse goes here. */
  addFields(fields: string[], line: number): void {
    if (fields.length === 1 && this.fieldCount > 1 && isBlank(fields[0])) return;
    this.begin(line);
    if (fields.length !== this.fieldCount) this.wrongFieldCount(fields.length);
    else for (let k = 0; k < this.slots.length; k++) this.cellString(k, fields[this.slots[k].index]);
    this.end();
  }

  finish(delimiter: Delimiter, parser: 'fast' | 'full'): Table {
    if (this.problemCount > 0) {
      const more = this.problemCount - this.problems.length;
      if (more > 0) this.problems.push({ code: 'data', file: this.file, message: `and ${more} more problem${more === 1 ? '' : 's'} like these` });
      throw new InputError(`${this.file}: ${this.problemCount} problem${this.problemCount === 1 ? '' : 's'} in the data; nothing was analysed`, this.problems);
    }
    if (this.rows === 0) {
      throw new InputError(`${this.file} has a header but no data rows`, [
        { code: 'data', file: this.file, line: 1, message: 'no data rows after the header', hint: 'one row per measurement or per unit, below the header row' },
      ]);
    }
    const columns: Record<string, Column> = {};
    for (const s of this.slots) {
      const name = s.request.name;
      columns[name] = s.numbers
        ? { kind: 'number', name, index: s.index, values: truncate(s.numbers, this.rows), missing: s.missing }
        : categoryColumn(name, s.index, s.codes!.subarray(0, this.rows), s.pool!, s.missing);
    }
    const lines = this.lines;
    const first = this.firstLine;
    const lineOf = lines ? (r: number): number => lines[r] : (r: number): number => first + r;
    return { file: this.file, header: this.header, delimiter, parser, rows: this.rows, lineOf, columns };
  }

  private problem(slot: Slot, message: string, hint: string): void {
    this.rowOk = false;
    this.add({
      code: 'data',
      file: this.file,
      line: this.line,
      col: slot.index + 1,
      message: `${message} (column '${slot.request.name}', field ${slot.index + 1})`,
      hint,
    });
  }

  private add(p: Problem): void {
    this.problemCount++;
    if (this.problems.length < MAX_LISTED_PROBLEMS) this.problems.push(p);
  }

  /**
   * Makes room for about `rows` rows at once (the plain scan estimates the count from the file
   * size), so a large file does not pass through a series of doublings and copies.
   */
  reserve(rows: number): void {
    if (rows > this.capacity) this.grow(rows);
    if (this.rows === 0) return;
    for (const s of this.slots) {
      // An id-like column (mostly distinct values) gets room for all its values too.
      if (s.pool && s.pool.count * 2 > this.rows) s.pool.reserve(Math.ceil((rows * s.pool.count) / this.rows), Math.ceil((rows * s.pool.size) / this.rows));
    }
  }

  private grow(to = this.capacity * 2): void {
    this.capacity = to;
    if (this.lines) {
      const lines = new Int32Array(this.capacity);
      lines.set(this.lines);
      this.lines = lines;
    }
    for (const s of this.slots) {
      if (s.numbers) {
        const a = numberArray(this.capacity);
        const old = s.numbers;
        for (let i = 0; i < this.rows; i++) a[i] = old[i];
        s.numbers = a;
      } else {
        const a = new Int32Array(this.capacity);
        a.set(s.codes!);
        s.codes = a;
      }
    }
  }
}

function categoryColumn(name: string, index: number, codes: Int32Array, pool: LevelPool, missing: number): Column {
  return {
    kind: 'category',
    name,
    index,
    codes,
    levelCount: pool.count,
    level: (code) => pool.level(code),
    find: (value) => pool.find(value),
    missing,
  };
}

/** Only ASCII white space: the plain scan skips such a line too. */
function isBlank(s: string): boolean {
  for (let i = 0; i < s.length; i++) if (!isAsciiSpace(s.charCodeAt(i))) return false;
  return true;
}
