/**
 * The plain scan: reads a CSV without quoting as bytes, in chunks, splits lines at '\n' (dropping a
 * '\r' before it) and fields at the delimiter, and hands only the requested cells to the collector.
 * No string is made per cell (numbers are read from the bytes, text cells are interned from them),
 * so a million-row file creates almost no garbage. It gives up (returns null) at the first double
 * quote, or at old Mac '\r'-only line ends, and the caller reads the file again with papaparse:
 * quoting is never half-handled.
 *
 * Why a second reader: on a 1,000,000-row file a byte scan takes about a third of papaparse's time
 * (measured in the shared DEPENDENCIES.md beside the project); tests run both readers on the same inputs.
 */
import { closeSync, fstatSync, openSync, readSync } from 'node:fs';
import { ColumnCollector } from './columns.js';
import { detectDelimiter, type DelimiterChoice } from './delimiter.js';
import type { ColumnRequest, Table } from './types.js';
import { emptyFile, splitHeader } from './header.js';
import { isAsciiSpace } from './intern.js';

const LF = 10;
const CR = 13;
const QUOTE = 34;

/** Scans byte chunks that each end at a line end (or at the end of the input). */
class ByteScanner {
  private collector: ColumnCollector | null = null;
  private delimiter = 44;
  private delimiterChar: ',' | ';' | '\t' = ',';
  private line = 0;
  private seen = 0;

  constructor(
    private readonly file: string,
    private readonly requests: ColumnRequest[],
    private readonly missing: ReadonlySet<string>,
    private readonly choice: DelimiterChoice,
    /** The file's size in bytes, when known, to size the columns from the first chunk. */
    private readonly totalBytes = 0,
  ) {}

  /** Scans src[from, to); false when the input needs the full parser. */
  chunk(src: Buffer, from: number, to: number): boolean {
    const quote = src.indexOf(QUOTE, from);
    if (quote !== -1 && quote < to) return false;
    let pos = from;
    while (pos < to) {
      // A loop in JavaScript beats Buffer.indexOf here: lines are short and each native call costs
      // more than scanning the two dozen bytes of a typical line.
      let nl = pos;
      while (nl < to && src[nl] !== LF) nl++;
      const end = nl > pos && src[nl - 1] === CR ? nl - 1 : nl;
      this.line++;
      if (this.collector === null) {
        if (!this.header(src, pos, end)) return false;
      } else {
        this.row(this.collector, src, pos, end);
      }
      pos = nl + 1;
    }
    const c = this.collector;
    if (this.seen === 0 && c && c.rows > 0 && this.totalBytes > to - from) {
      c.reserve(Math.ceil((c.rows / (to - from)) * this.totalBytes * 1.02) + 64);
    }
    this.seen += to - from;
    return true;
  }

  private header(src: Buffer, pos: number, end: number): boolean {
    const text = src.toString('utf8', pos, end);
    if (text.trim() === '') return true;
    if (text.indexOf('\r') !== -1) return false;
    this.delimiterChar = this.choice === 'auto' ? detectDelimiter(text, this.file) : this.choice;
    this.delimiter = this.delimiterChar.charCodeAt(0);
    this.collector = new ColumnCollector(this.file, splitHeader(text, this.delimiterChar), this.requests, this.missing);
    return true;
  }

  private row(c: ColumnCollector, src: Buffer, pos: number, end: number): void {
    const delim = this.delimiter;
    const slots = c.slots;
    const nslots = slots.length;
    let blank = true;
    for (let i = pos; i < end && blank; i++) blank = isAsciiSpace(src[i]);
    if (blank && c.fieldCount > 1) return;
    c.begin(this.line);
    let field = 0;
    let k = 0;
    let want = nslots > 0 ? slots[0].index : -1;
    let start = pos;
    for (let i = pos; i <= end; i++) {
      if (i < end && src[i] !== delim) continue;
      if (field === want) {
        c.cellBytes(k, src, start, i);
        k++;
        want = k < nslots ? slots[k].index : -1;
      }
      field++;
      start = i + 1;
    }
    if (field !== c.fieldCount) c.wrongFieldCount(field);
    c.end();
  }

  finish(): Table {
    if (!this.collector) throw emptyFile(this.file);
    return this.collector.finish(this.delimiterChar, 'fast');
  }
}

const BOM = [0xef, 0xbb, 0xbf];

function bomLength(src: Buffer, length: number): number {
  return length >= 3 && src[0] === BOM[0] && src[1] === BOM[1] && src[2] === BOM[2] ? 3 : 0;
}

/** The plain scan of text in memory (tests). Null: needs the full parser. */
export function scanText(text: string, file: string, requests: ColumnRequest[], missing: ReadonlySet<string>, choice: DelimiterChoice): Table | null {
  const src = Buffer.from(text, 'utf8');
  const s = new ByteScanner(file, requests, missing, choice);
  return s.chunk(src, bomLength(src, src.length), src.length) ? s.finish() : null;
}

/**
 * The plain scan of a file, `chunkSize` bytes at a time (64 kB: one reused buffer, and the file
 * size lets the columns be sized once from the first chunk); memory stays at one chunk plus the
 * requested columns. Null: the file needs the full parser.
 */
export function scanFile(path: string, file: string, requests: ColumnRequest[], missing: ReadonlySet<string>, choice: DelimiterChoice, chunkSize = 1 << 16): Table | null {
  const fd = openSync(path, 'r');
  try {
    const s = new ByteScanner(file, requests, missing, choice, fstatSync(fd).size);
    let buf = Buffer.allocUnsafe(chunkSize);
    let carry = 0;
    let first = true;
    for (;;) {
      if (carry === buf.length) {
        const bigger = Buffer.allocUnsafe(buf.length * 2);
        buf.copy(bigger, 0, 0, carry);
        buf = bigger;
      }
      const got = readSync(fd, buf, carry, buf.length - carry, null);
      const filled = carry + got;
      const cut = got === 0 ? filled - 1 : buf.lastIndexOf(LF, filled - 1);
      if (got > 0 && cut < 0) {
        carry = filled;
        continue;
      }
      const from = first ? bomLength(buf, filled) : 0;
      first = false;
      if (!s.chunk(buf, from, cut + 1)) return null;
      if (got === 0) return s.finish();
      carry = filled - cut - 1;
      buf.copy(buf, 0, cut + 1, filled);
    }
  } finally {
    closeSync(fd);
  }
}
