/**
 * Choosing the field delimiter from the header line: comma, semicolon or tab, whichever occurs
 * most often outside double quotes. Spreadsheets set to a decimal comma save CSV with semicolons,
 * and tab-separated exports are common, so guessing from the header is the friendly default;
 * `--delimiter` (or the plan's `data.delimiter`) overrides it.
 */
import { InputError } from '../errors.js';

export type Delimiter = ',' | ';' | '\t';
export type DelimiterChoice = Delimiter | 'auto';

export const DELIMITER_NAMES: Record<Delimiter, string> = { ',': 'comma', ';': 'semicolon', '\t': 'tab' };

/** Accepts `,` `;` `\t` (or the words comma, semicolon, tab, auto). */
export function parseDelimiterOption(raw: string): DelimiterChoice {
  const words: Record<string, DelimiterChoice> = {
    ',': ',', comma: ',', ';': ';', semicolon: ';', '\t': '\t', '\\t': '\t', tab: '\t', auto: 'auto',
  };
  const d = words[raw.toLowerCase()];
  if (!d) throw new InputError(`--delimiter must be one of comma (,), semicolon (;), tab or auto; got '${raw}'`);
  return d;
}

/**
 * The delimiter of a header line. A header with none of the three is a single column (comma is
 * returned); two delimiters equally frequent are ambiguous and need `--delimiter`.
 * Example: `plot;yield_kg;"rain, mm"` gives ';' (the comma is inside quotes).
 */
export function detectDelimiter(headerLine: string, file: string): Delimiter {
  const counts: Record<Delimiter, number> = { ',': 0, ';': 0, '\t': 0 };
  let quoted = false;
  for (const ch of headerLine) {
    if (ch === '"') quoted = !quoted;
    else if (!quoted && (ch === ',' || ch === ';' || ch === '\t')) counts[ch]++;
  }
  const ranked = (Object.keys(counts) as Delimiter[]).sort((a, b) => counts[b] - counts[a]);
  const [best, next] = ranked;
  if (counts[best] === 0) return ',';
  if (counts[best] === counts[next]) {
    throw new InputError(
      `cannot tell the delimiter of ${file}: its header has as many ${DELIMITER_NAMES[best]}s as ${DELIMITER_NAMES[next]}s`,
      [{ code: 'data', file, line: 1, message: 'ambiguous delimiter in the header line', hint: 'give --delimiter comma, semicolon or tab' }],
    );
  }
  return best;
}
