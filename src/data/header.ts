/** Small pieces both readers share: header names, and the messages for files with no table. */
import { InputError } from '../errors.js';

/** Header names of an unquoted header line, trimmed; an empty name becomes `(field N)`. */
export function splitHeader(line: string, delimiter: string): string[] {
  return cleanHeader(line.split(delimiter));
}

export function cleanHeader(fields: string[]): string[] {
  return fields.map((f, i) => {
    const name = f.trim();
    return name === '' ? `(field ${i + 1})` : name;
  });
}

export function emptyFile(file: string): InputError {
  return new InputError(`${file} is empty: expected a header row naming the columns, then one row per record`, [
    { code: 'data', file, line: 1, message: 'no header row', hint: 'the first line names the columns, e.g. panel,before_mm,after_mm' },
  ]);
}

/** Files saved as UTF-16 (a byte-order mark FF FE or FE FF) read as garbage: refuse them by name. */
export function checkEncoding(first: Buffer, file: string): void {
  if (first.length >= 2 && ((first[0] === 0xff && first[1] === 0xfe) || (first[0] === 0xfe && first[1] === 0xff))) {
    throw new InputError(`${file} is saved as UTF-16; tandem reads UTF-8 (with or without a byte-order mark)`, [
      { code: 'data', file, line: 1, message: 'UTF-16 byte-order mark', hint: "save the file again as 'CSV UTF-8'" },
    ]);
  }
}
