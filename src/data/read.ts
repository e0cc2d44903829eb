/**
 * Reading the requested columns of a CSV file: the plain scan first, papaparse when the file has
 * quotes. This is the data layer's only entry for files; everything after it is pure.
 */
import { openSync, readFileSync, readSync, closeSync, statSync } from 'node:fs';
import { InputError } from '../errors.js';
import { missingSet } from './cells.js';
import { scanFile, scanText } from './csv-fast.js';
import { parseFull } from './csv-full.js';
import { checkEncoding, emptyFile } from './header.js';
import type { ColumnRequest, ReadOptions, Table } from './types.js';

/** Reads `path` (shown to the user as `file`). */
export function readTable(path: string, requests: ColumnRequest[], options: ReadOptions = {}, file = path): Table {
  let size: number;
  try {
    const st = statSync(path);
    if (st.isDirectory()) throw new InputError(`${file} is a folder; --data takes a CSV file`);
    size = st.size;
  } catch (err) {
    if (err instanceof InputError) throw err;
    const code = (err as NodeJS.ErrnoException).code;
    throw new InputError(code === 'ENOENT' ? `data file not found: ${file}` : `cannot read data file ${file} (${code ?? String(err)})`);
  }
  if (size === 0) throw emptyFile(file);
  checkEncoding(firstBytes(path), file);
  const reqs = uniqueRequests(requests);
  const missing = missingSet(options.missing);
  const choice = options.delimiter ?? 'auto';
  const parser = options.parser ?? 'auto';
  if (parser !== 'full') {
    const t = scanFile(path, file, reqs, missing, choice, options.chunkSize);
    if (t) return t;
    if (parser === 'fast') throw new Error('the plain scan cannot read a file with quotes');
  }
  return parseFull(readFileSync(path, 'utf8'), file, reqs, missing, choice);
}

/** The same from text already in memory (tests, and data from stdin). */
export function readTableFromText(text: string, file: string, requests: ColumnRequest[], options: ReadOptions = {}): Table {
  if (text.trim() === '' || text === '\ufeff') throw emptyFile(file);
  const reqs = uniqueRequests(requests);
  const missing = missingSet(options.missing);
  const choice = options.delimiter ?? 'auto';
  const parser = options.parser ?? 'auto';
  if (parser !== 'full') {
    const t = scanText(text, file, reqs, missing, choice);
    if (t) return t;
    if (parser === 'fast') throw new Error('the plain scan cannot read text with quotes');
  }
  return parseFull(text, file, reqs, missing, choice);
}

/** A column may serve one role only: naming it as, say, both id and first value is a slip. */
function uniqueRequests(requests: ColumnRequest[]): ColumnRequest[] {
  const byName = new Map<string, ColumnRequest>();
  for (const r of requests) {
    const had = byName.get(r.name);
    if (had) throw new InputError(`the column '${r.name}' is named as both the ${had.role} and the ${r.role} column; each role needs its own column`);
    byName.set(r.name, r);
  }
  return [...byName.values()];
}

function firstBytes(path: string): Buffer {
  const fd = openSync(path, 'r');
  try {
    const b = Buffer.alloc(4);
    const n = readSync(fd, b, 0, 4, 0);
    return b.subarray(0, n);
  } finally {
    closeSync(fd);
  }
}
