/**
 * Binary outcomes (McNemar, two proportions) arrive as text and become 1 (the event) or 0.
 * Recognised without help: 0/1, yes/no and true/false (any letter case). Anything else needs the
 * event value named (`--event VALUE`, or the plan's `study.event`), because tandem will not guess
 * whether "pass" or "fail" is the event.
 */
import { InputError } from '../errors.js';

const PAIRS: [string, string][] = [
  ['1', '0'],
  ['yes', 'no'],
  ['true', 'false'],
];

/**
 * A 0/1 value for each distinct text value. Example: values ['no', 'Yes'] with no event named
 * give { no: 0, Yes: 1 }; with event 'pass', values ['pass', 'fail'] give { pass: 1, fail: 0 }.
 */
export function binaryMap(values: string[], event: string | undefined, where: string): Map<string, 0 | 1> {
  const distinct = [...new Set(values)];
  const listed = distinct.map((v) => `'${v}'`).join(', ');
  const map = new Map<string, 0 | 1>();
  if (event !== undefined) {
    if (!distinct.includes(event) && distinct.length > 1) {
      throw new InputError(`${where}: the event value '${event}' does not occur; the values are ${listed} (values are case-sensitive)`);
    }
    if (distinct.length > 2) {
      throw new InputError(`${where}: a binary outcome has two values, the event '${event}' and one other; found ${listed}`);
    }
    for (const v of distinct) map.set(v, v === event ? 1 : 0);
    return map;
  }
  // Without an event named, letter case does not matter: 'Yes' and 'yes' are the same answer.
  const lower = distinct.map((v) => v.toLowerCase());
  const kinds = [...new Set(lower)];
  if (kinds.length > 2) {
    throw new InputError(`${where}: a binary outcome has two values; found ${kinds.length}: ${listed}`);
  }
  const pair = PAIRS.find(([yes, no]) => kinds.every((v) => v === yes || v === no));
  if (!pair) {
    throw new InputError(`${where}: cannot tell which value is the event among ${listed}`, [
      { code: 'data', message: 'unrecognised binary values', hint: 'give --event VALUE (in a plan: study.event); 0/1, yes/no and true/false are recognised' },
    ]);
  }
  distinct.forEach((v, i) => map.set(v, lower[i] === pair[0] ? 1 : 0));
  return map;
}
