/**
 * Which question to ask next, and whether an answer fits its question. A question is asked only
 * when its guard holds on the earlier answers, so the interview never asks what cannot matter.
 *
 * Example (an invented ferry-timetable study): once `measurements_per_unit` is `one`, the
 * question about before/after versus two instruments is skipped and `pairing` comes next.
 */
import type { AnswerValue, Answers, Question } from './types.js';
import type { RuleBase } from './model.js';
import { walkAnswers } from './facts.js';
import { questionAsShown } from './templates.js';

/** The next question that matters given the answers, or null when none is left. */
export function nextQuestion(rb: RuleBase, answers: Answers): Question | null {
  const q = walkAnswers(rb, answers, true).next;
  return q && questionAsShown(q, answers);
}

/** The questions asked on the path the answers determine, in order (answered or not). */
export function questionsOnPath(rb: RuleBase, answers: Answers): Question[] {
  return walkAnswers(rb, answers).asked;
}

/**
 * Why a value does not fit the question, or null when it fits. Blank ('') fits an optional
 * question only. Numbers must be finite, whole when the question says so, and inside min..max
 * (strictly above min when `minExclusive`).
 */
export function answerProblem(q: Question, v: AnswerValue | undefined | null): string | null {
  if (v === undefined || v === null || v === '') return q.optional ? null : `'${q.id}' needs an answer`;
  if (q.type === 'choice') {
    const values = (q.choices ?? []).map((c) => c.value);
    return typeof v === 'string' && values.includes(v) ? null : `'${q.id}' must be one of ${values.join(', ')}; got ${JSON.stringify(v)}`;
  }
  if (q.type === 'number') {
    if (typeof v !== 'number' || !Number.isFinite(v)) return `'${q.id}' must be a number; got ${JSON.stringify(v)}`;
    if (q.integer && !Number.isInteger(v)) return `'${q.id}' must be a whole number; got ${v}`;
    if (q.min !== undefined && q.minExclusive && v <= q.min) return `'${q.id}' must be greater than ${q.min}; got ${v}`;
    if (q.min !== undefined && v < q.min) return `'${q.id}' must be at least ${q.min}; got ${v}`;
    if (q.max !== undefined && v > q.max) return `'${q.id}' must be at most ${q.max}; got ${v}`;
    return null;
  }
  return typeof v === 'string' ? null : `'${q.id}' must be text; got ${JSON.stringify(v)}`;
}
