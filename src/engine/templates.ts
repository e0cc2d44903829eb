/**
 * Texts in rule files may name answers with a closed placeholder syntax: `{first_label}` is
 * replaced by the answer, `{event|the event}` by the answer or, when it was not given, by the
 * text after the bar. Nothing else is interpreted (no expressions, no eval).
 *
 * Example: "each difference is {first_label} minus {second_label}" with first_label "new glaze"
 * and second_label "old glaze" reads "each difference is new glaze minus old glaze".
 */
import type { AnswerValue } from './types.js';

export const PLACEHOLDER = /\{([a-z_][a-z0-9_]*)(?:\|([^{}]*))?\}/g;

/** The placeholder names used in a text (for checks at load). */
export function placeholders(text: string): string[] {
  return [...text.matchAll(PLACEHOLDER)].map((m) => m[1]);
}

function show(v: AnswerValue): string {
  if (typeof v === 'number') return Number.isInteger(v) ? String(v) : String(Number(v.toPrecision(6)));
  return String(v);
}

/** Fills placeholders; a missing value without a default leaves a neutral word in its place. */
export function fill(text: string, lookup: (name: string) => AnswerValue | undefined): string {
  const out = text.replace(PLACEHOLDER, (_m, name: string, dflt: string | undefined) => {
    const v = lookup(name);
    if (v !== undefined && v !== '') return show(v);
    return dflt ?? '';
  });
  // A blank optional answer (e.g. no outcome unit) can leave doubled spaces or a space before
  // punctuation; tidy those so the sentence still reads well.
  return out.replace(/[ \t]{2,}/g, ' ').replace(/ +([,.;:)])/g, '$1').replace(/\( +/g, '(').trim();
}
