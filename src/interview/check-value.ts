/**
 * One answer checked against its question, with the same rules whether it was typed at a prompt
 * or read from an answers file: a choice must be one of the listed values, a number must be a
 * finite number inside the question's range (and whole when the question says so), a text must
 * not be blank. An optional question left blank is recorded as the empty string '' so that the
 * interview moves on; the engine reads '' as "not given".
 */
import type { AnswerValue, Question } from '../engine/types.js';

export type ValueCheck =
  | { ok: true; value: AnswerValue }
  | { ok: false; code: 'unknown-value' | 'wrong-type'; message: string; hint: string };

/** Longest text answer accepted (labels and names, not essays). */
export const MAX_TEXT = 500;

/** What the question accepts, in words: "one of: a, b", "a whole number from 2 to 500", ... */
export function describeAllowed(q: Question): string {
  const blank = q.optional ? ', or blank' : '';
  if (q.type === 'choice') return `one of: ${(q.choices ?? []).map((c) => c.value).join(', ')}${blank}`;
  if (q.type === 'text') return `text up to ${MAX_TEXT} characters${blank}`;
  const kind = q.integer ? 'a whole number' : 'a number';
  const lo = q.min !== undefined;
  const hi = q.max !== undefined;
  const range = q.minExclusive && lo
    ? ` greater than ${q.min}${hi ? ` and at most ${q.max}` : ''}`
    : lo && hi ? ` from ${q.min} to ${q.max}` : lo ? ` of at least ${q.min}` : hi ? ` of at most ${q.max}` : '';
  return `${kind}${range}${blank}`;
}

export function checkValue(q: Question, raw: unknown): ValueCheck {
  const allowed = describeAllowed(q);
  const bad = (code: 'unknown-value' | 'wrong-type', message: string): ValueCheck => ({ ok: false, code, message, hint: `allowed: ${allowed}` });
  if (raw === null || raw === undefined || raw === '') {
    return q.optional ? { ok: true, value: '' } : bad('wrong-type', `'${q.id}' needs an answer`);
  }
  if (typeof raw === 'object') return bad('wrong-type', `'${q.id}' must be a single value, not a list or mapping`);
  if (q.type === 'choice') {
    // A YAML scalar such as 2 or true may stand for the choice value '2' or 'true'.
    const s = String(raw);
    if ((q.choices ?? []).some((c) => c.value === s)) return { ok: true, value: s };
    return bad('unknown-value', `'${s}' is not an answer to '${q.id}'`);
  }
  if (q.type === 'number') {
    if (typeof raw !== 'number') return bad('wrong-type', `'${q.id}' must be a number, not ${JSON.stringify(raw)}`);
    if (!Number.isFinite(raw)) return bad('unknown-value', `'${q.id}' must be a finite number`);
    if (q.integer && !Number.isInteger(raw)) return bad('unknown-value', `'${q.id}' must be a whole number, not ${raw}`);
    if (q.min !== undefined && q.minExclusive && raw <= q.min) return bad('unknown-value', `'${q.id}' is ${raw}; it must be greater than ${q.min}`);
    if (q.min !== undefined && raw < q.min) return bad('unknown-value', `'${q.id}' is ${raw}, below the smallest allowed value ${q.min}`);
    if (q.max !== undefined && raw > q.max) return bad('unknown-value', `'${q.id}' is ${raw}, above the largest allowed value ${q.max}`);
    return { ok: true, value: raw };
  }
  // text: a number or yes/no in YAML is taken as its text ("2019" as a condition label).
  const s = String(raw).trim();
  if (s === '') return q.optional ? { ok: true, value: '' } : bad('wrong-type', `'${q.id}' needs an answer`);
  if (s.length > MAX_TEXT) return bad('unknown-value', `'${q.id}' is longer than ${MAX_TEXT} characters`);
  return { ok: true, value: s };
}

/** A plain decimal number as people type it: 12, -3, 0.5, .5, 1e3. No hex, no "Infinity". */
const NUMBER_TEXT = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/** A typed answer (a string from the prompt) turned into a value, or the message to show. */
export function parseTyped(q: Question, typed: string): { ok: true; value: AnswerValue } | { ok: false; message: string } {
  const s = typed.trim();
  if (s === '') {
    return q.optional ? { ok: true, value: '' } : { ok: false, message: 'An answer is needed here (type ? for an explanation).' };
  }
  let raw: unknown = s;
  if (q.type === 'number') {
    if (!NUMBER_TEXT.test(s)) return { ok: false, message: `'${s}' is not a number; type digits such as 12 or 0.5 (${describeAllowed(q)}).` };
    raw = Number(s);
  }
  const c = checkValue(q, raw);
  if (c.ok) return c;
  return { ok: false, message: `${sentenceFor(q, raw)} Allowed: ${describeAllowed(q)}.` };
}

function sentenceFor(q: Question, raw: unknown): string {
  if (q.type !== 'number' || typeof raw !== 'number') return 'That answer is not accepted.';
  if (q.integer && !Number.isInteger(raw)) return `${raw} is not a whole number.`;
  if (q.min !== undefined && (raw < q.min || (q.minExclusive && raw === q.min))) return `${raw} is too small.`;
  if (q.max !== undefined && raw > q.max) return `${raw} is too large.`;
  return 'That number is not accepted.';
}
