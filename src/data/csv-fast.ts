/**
 * The plain scan: reads a CSV without quoting in chunks, splits lines at '\n' (dropping a '\r'
 * before it) and fields at the delimiter, and hands only the requested cells to the collector.
 * It gives up (returns null) at the first double quote or at old Mac '\r'-only line ends, and the
 * caller reads the file again with papaparse, so quoting is never half-handled.
 *
 * Why a second reader: on a 1,000,000-row file a byte scan takes about a third of papaparse's time
 * (measured in ../shared/DEPENDENCIES.md); tests run both readers on the same inputs.
 */
import { closeSync, fstatSync, openSync, readSync } from 'node:fs';
import { ColumnCollector } from './columns.js';
import { detectDelimiter, type Delimiter, type DelimiterChoice } from './delimiter.js';
import type { ColumnRequest, Table } from './types.js';
import { emptyFile, splitHeader } from './header.js';

interface ScanState {
  collector: ColumnCollector | null;
  delimiter: Delimiter | null;
  line: number;
}

/** Scans text chunks that each end at a line end (or at the end of the input). */
class FastScanner {
  private state: ScanState = { collector: null, delimiter: null, line: 0 };
  private seen = 0;
  constructor(
    private readonly file: string,
    private readonly requests: ColumnRequest[],
    private readonly missing: ReadonlySet<string>,
    private readonly choice: DelimiterChoice,
    /** The file's size in bytes, when known, to size the columns from the first chunk. */
    private readonly totalBytes = 0,
  ) {}

  /** False when the text needs the full parser. */
  chunk(text: string): boolean {
    if (text.indexOf('"') !== -1) return false;
    const st = this.state;
    let pos = 0;
    const len = text.length;
    while (pos < len) {
      let nl = text.indexOf('\n', pos);
      if (nl === -1) nl = len;
      let end = nl;
      if (end > pos && text.charCodeAt(end - 1) === 13) end--;
      st.line++;
      if (st.collector === null) {
        const header = text.slice(pos, end);
        if (header.trim() !== '') {
          if (header.indexOf('\r') !== -1) return false;
          st.delimiter = this.choice === 'auto' ? detectDelimiter(header, this.file) : this.choice;
          st.collector = new ColumnCollector(this.file, splitHeader(header, st.delimiter), this.requests, this.missing);
        }
      } else {
        this.row(st.collector, st.delimiter!, text, pos, end, st.line);
      }
      pos = nl + 1;
    }
    if (this.seen === 0 && st.collector && st.collector.rows > 0 && this.totalBytes > len) {
      st.collector.reserve(Math.ceil((st.collector.rows / len) * this.totalBytes * 1.02) + 64);
    }
    this.seen += len;
    return true;
  }

  private row(c: ColumnCollector, delim: string, text: string, pos: number, end: number, line: number): void {
    const slots = c.slots;
    const nslots = slots.length;
    let d = text.indexOf(delim, pos);
    if (d === -1 || d > end) {
      if (c.fieldCount > 1 && text.slice(pos, end).trim() === '') return;
      d = end;
    }
    c.begin(line);
    let field = 0;
    let k = 0;
    let want = nslots > 0 ? slots[0].index : -1;
    let start = pos;
    for (;;) {
      if (field === want) {
        c.cell(k, text, start, d);
        k++;
        want = k < nslots ? slots[k].index : -1;
      }
      field++;
      if (d === end) break;
      start = d + 1;
      d = text.indexOf(delim, start);
      if (d === -1 || d > end) d = end;
    }
    if (field !== c.fieldCount) c.wrongFieldCount(field);
    c.end();
  }

  finish(): Table {
    if (!this.state.collector) throw emptyFile(this.file);
    return this.state.collector.finish(this.state.delimiter!, 'fast');
  }
}

/** The plain scan of a string (tests, and inputs already in memory). Null: needs the full parser. */
export function scanText(text: string, file: string, requests: ColumnRequest[], missing: ReadonlySet<string>, choice: DelimiterChoice): Table | null {
  const s = new FastScanner(file, requests, missing, choice);
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  return s.chunk(body) ? s.finish() : null;
}

/**
 * The plain scan of a file, `chunkSize` bytes at a time; memory stays at one chunk plus the
 * requested columns. Null: the file needs the full parser.
 */
export function scanFile(path: string, file: string, requests: ColumnRequest[], missing: ReadonlySet<string>, choice: DelimiterChoice, chunkSize = 1 << 20): Table | null {
  const fd = openSync(path, 'r');
  try {
    const s = new FastScanner(file, requests, missing, choice, fstatSync(fd).size);
    let buf = Buffer.allocUnsafe(chunkSize);
    let carry = 0;
    let bomChecked = false;
    for (;;) {
      if (carry === buf.length) {
        const bigger = Buffer.allocUnsafe(buf.length * 2);
        buf.copy(bigger, 0, 0, carry);
        buf = bigger;
      }
      const got = readSync(fd, buf, carry, buf.length - carry, null);
      const filled = carry + got;
      const cut = got === 0 ? filled - 1 : buf.lastIndexOf(10, filled - 1);
      if (got > 0 && cut < 0) {
        carry = filled;
        continue;
      }
      let from = 0;
      if (!bomChecked) {
        bomChecked = true;
        if (filled >= 3 && buf[0] === 0xef && buf[1] === 0xbb && buf[2] === 0xbf) from = 3;
      }
      if (got === 0) {
        if (filled > from && !s.chunk(buf.toString('utf8', from, filled))) return null;
        return s.finish();
      }
      // '\n' never occurs inside a multi-byte UTF-8 character, so cutting after it is safe.
      if (!s.chunk(buf.toString('utf8', from, cut + 1))) return null;
      carry = filled - cut - 1;
      buf.copy(buf, 0, cut + 1, filled);
    }
  } finally {
    closeSync(fd);
  }
}
