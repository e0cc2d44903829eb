/**
 * Texts in rule files may name answers with a closed placeholder syntax: `{first_label}` is
 * replaced by the answer, `{event|the event}` by the answer or, when it was not given, by the
 * text after the bar. Nothing else is interpreted (no expressions, no eval).
 *
 * Example: "each difference is {first_label} minus {second_label}" with first_label "new glaze"
 * and second_label "old glaze" reads "each difference is new glaze minus old glaze".
 */
import type { Answers, AnswerValue, Question } from './types.js';

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

/**
 * The question with its texts filled from earlier answers: "{first_label|the first condition}
 * gives higher values" reads "kiln A gives higher values" once first_label is known, and keeps
 * its default otherwise (the rule check allows only earlier questions, with a default).
 */
export function questionAsShown<Q extends Question>(q: Q, answers: Answers): Q {
  const f = (t: string): string => (t.includes('{') ? fill(t, (name) => answers[name]) : t);
  return {
    ...q,
    text: f(q.text),
    help: f(q.help),
    ...(q.choices ? { choices: q.choices.map((c) => ({ ...c, label: f(c.label), help: f(c.help) })) } : {}),
  };
}
