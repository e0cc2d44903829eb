/**
 * Materialising only the requested columns while a reader walks the rows. Both readers (the
 * plain scan and papaparse) feed cells through `numberCell` / `categoryCell`, so one file gives
 * the same table whichever reader ran. Problems are collected (up to a limit) and raised together.
 */
import { InputError } from '../errors.js';
import type { Problem } from '../problems.js';
import { fastNumber, hasNumericMarker, readNumberCell } from './cells.js';
import type { Delimiter } from './delimiter.js';
import { isSpace, LevelPool } from './intern.js';
import type { Column, ColumnRequest, Table } from './types.js';

/** More problems than this are counted, not listed. */
export const MAX_LISTED_PROBLEMS = 20;

interface Slot {
  request: ColumnRequest;
  index: number;
  numbers?: Float64Array;
  codes?: Int32Array;
  pool?: LevelPool;
  missing: number;
}

export class ColumnCollector {
  readonly slots: Slot[];
  readonly fieldCount: number;
  rows = 0;
  private lines = new Int32Array(1024);
  private capacity = 1024;
  private line = 0;
  private rowOk = true;
  private readonly problems: Problem[] = [];
  private problemCount = 0;
  private readonly useFast: boolean;
  private readonly markers: string[];

  constructor(
    readonly file: string,
    readonly header: string[],
    requests: ColumnRequest[],
    private readonly missing: ReadonlySet<string>,
  ) {
    this.fieldCount = header.length;
    this.useFast = !hasNumericMarker(missing);
    this.markers = [...missing].filter((m) => m !== '');
    this.slots = resolveColumns(file, header, requests)
      .map(({ request, index }): Slot => {
        const slot: Slot = { request, index, missing: 0 };
        if (request.kind === 'number') slot.numbers = new Float64Array(this.capacity);
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

  /** The cell `text.slice(start, end)` of slot `k` (slots are in field order). */
  cell(k: number, text: string, start: number, end: number): void {
    const slot = this.slots[k];
    const row = this.rows;
    if (slot.numbers) {
      if (start === end) {
        slot.numbers[row] = NaN;
        slot.missing++;
        return;
      }
      const quick = this.useFast ? fastNumber(text, start, end) : NaN;
      if (quick === quick) {
        slot.numbers[row] = quick;
        return;
      }
      const r = readNumberCell(text.slice(start, end), this.missing);
      if (r.kind === 'value') slot.numbers[row] = r.value;
      else {
        slot.numbers[row] = NaN;
        if (r.kind === 'missing') slot.missing++;
        else this.problem(slot, r.message, r.hint);
      }
      return;
    }
    while (start < end && isSpace(text.charCodeAt(start))) start++;
    while (end > start && isSpace(text.charCodeAt(end - 1))) end--;
    if (start === end || this.isMarker(text, start, end)) {
      slot.codes![row] = -1;
      slot.missing++;
      return;
    }
    slot.codes![row] = slot.pool!.intern(text, start, end);
  }

  private isMarker(text: string, start: number, end: number): boolean {
    for (const m of this.markers) if (m.length === end - start && text.startsWith(m, start)) return true;
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
    this.lines[this.rows] = this.line;
    this.rows++;
  }

  /** Every row from papaparse goes here. */
  addFields(fields: string[], line: number): void {
    if (fields.length === 1 && fields[0].trim() === '' && this.fieldCount > 1) return;
    this.begin(line);
    if (fields.length !== this.fieldCount) this.wrongFieldCount(fields.length);
    else for (let k = 0; k < this.slots.length; k++) this.cell(k, fields[this.slots[k].index], 0, fields[this.slots[k].index].length);
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
        ? { kind: 'number', name, index: s.index, values: s.numbers.subarray(0, this.rows), missing: s.missing }
        : categoryColumn(name, s.index, s.codes!.subarray(0, this.rows), s.pool!, s.missing);
    }
    return { file: this.file, header: this.header, delimiter, parser, rows: this.rows, lines: this.lines.subarray(0, this.rows), columns };
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
  }

  private grow(to = this.capacity * 2): void {
    this.capacity = to;
    const lines = new Int32Array(this.capacity);
    lines.set(this.lines);
    this.lines = lines;
    for (const s of this.slots) {
      if (s.numbers) {
        const a = new Float64Array(this.capacity);
        a.set(s.numbers);
        s.numbers = a;
      } else {
        const a = new Int32Array(this.capacity);
        a.set(s.codes!);
        s.codes = a;
      }
    }
  }
}

/** Finds each requested column in the header; unknown or doubled names list what exists. */
export function resolveColumns(file: string, header: string[], requests: ColumnRequest[]): { request: ColumnRequest; index: number }[] {
  const problems: Problem[] = [];
  const out: { request: ColumnRequest; index: number }[] = [];
  const existing = header.map((h) => `'${h}'`).join(', ');
  for (const request of requests) {
    const hits = header.flatMap((h, i) => (h === request.name ? [i] : []));
    if (hits.length === 1) out.push({ request, index: hits[0] });
    else if (hits.length > 1) {
      problems.push({
        code: 'data', file, line: 1, col: hits[1] + 1,
        message: `the ${request.role} column '${request.name}' appears ${hits.length} times in the header (fields ${hits.map((i) => i + 1).join(', ')})`,
        hint: 'rename the columns so that each name is used once',
      });
    } else {
      const near = header.find((h) => h.toLowerCase() === request.name.toLowerCase());
      problems.push({
        code: 'data', file, line: 1,
        message: `no column named '${request.name}' (wanted as the ${request.role} column)`,
        hint: near !== undefined ? `did you mean '${near}'? names are case-sensitive; the columns are ${existing}` : `the columns are ${existing}`,
      });
    }
  }
  if (problems.length > 0) {
    throw new InputError(`${file}: ${problems.length === 1 ? 'a column was' : 'columns were'} not found as named`, problems);
  }
  return out;
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
