/** Finding the requested columns in a header, by exact name, with messages that list what exists. */
import { InputError } from '../errors.js';
import type { Problem } from '../problems.js';
import type { ColumnRequest } from './types.js';

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
