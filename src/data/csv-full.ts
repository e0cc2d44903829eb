/**
 * The full reader: papaparse (v5) for files with quoted fields (delimiters, line breaks or doubled
 * quotes inside quotes). The file is read whole, then walked row by row with `step`, so rows are
 * not kept: only the requested cells reach the collector. Line numbers follow papaparse's cursor,
 * so a quoted field that spans lines does not shift the lines reported after it.
 */
import { createRequire } from 'node:module';
import type * as PapaNS from 'papaparse';
import { ColumnCollector } from './columns.js';
import { detectDelimiter, type Delimiter, type DelimiterChoice } from './delimiter.js';
import { cleanHeader, emptyFile } from './header.js';
import type { ColumnRequest, Table } from './types.js';

let papa: typeof PapaNS | undefined;

/** papaparse is loaded on first use: files without quotes never need it. */
function papaparse(): typeof PapaNS {
  papa ??= createRequire(import.meta.url)('papaparse') as typeof PapaNS;
  return papa;
}

export function parseFull(text: string, file: string, requests: ColumnRequest[], missing: ReadonlySet<string>, choice: DelimiterChoice): Table {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const firstLine = body.replace(/^\s*\n/, '').split(/\r\n|\n|\r/, 1)[0] ?? '';
  if (body.trim() === '') throw emptyFile(file);
  const delimiter: Delimiter = choice === 'auto' ? detectDelimiter(firstLine, file) : choice;

  const crOnly = body.indexOf('\n') === -1;
  let collector: ColumnCollector | null = null;
  let prevCursor = 0;
  let line = 1;
  papaparse().parse<string[]>(body, {
    delimiter,
    // newline left out: papaparse detects \n, \r\n or \r from the text.
    quoteChar: '"',
    escapeChar: '"',
    skipEmptyLines: false,
    step: (results) => {
      const startLine = line;
      const cursor = results.meta.cursor;
      for (let i = body.indexOf('\n', prevCursor); i !== -1 && i < cursor; i = body.indexOf('\n', i + 1)) line++;
      if (crOnly) line += countCR(body, prevCursor, cursor);
      prevCursor = cursor;
      const fields = results.data;
      if (collector === null) {
        if (fields.length === 1 && fields[0].trim() === '') return;
        collector = new ColumnCollector(file, cleanHeader(fields), requests, missing);
        return;
      }
      if (results.errors.length > 0) {
        collector.begin(startLine);
        const e = results.errors[0];
        collector.rowProblem(
          e.code === 'MissingQuotes' ? 'a quoted field is not closed' : `malformed quoting (${e.message})`,
          'a quoted field starts and ends with a double quote; a quote inside it is written twice ("")',
        );
        collector.end();
        return;
      }
      collector.addFields(fields, startLine);
    },
  });
  if (collector === null) throw emptyFile(file);
  return (collector as ColumnCollector).finish(delimiter, 'full');
}

/** Old Mac files end lines with '\r' alone: count those when there is no '\n' at all. */
function countCR(text: string, from: number, to: number): number {
  let n = 0;
  for (let i = text.indexOf('\r', from); i !== -1 && i < to; i = text.indexOf('\r', i + 1)) n++;
  return n;
}
