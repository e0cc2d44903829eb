/**
 * Walking the question path: starting from no answers, ask `next` for the question that matters
 * now, take its answer if one is known, and repeat. The walk tells which given answers were used
 * (on the path), which were not (they no longer apply), and which questions are still missing.
 *
 * Example (invented, a kiln trial): answers { firing: 'same-kiln', tiles: 40, glaze: 'matt' }
 * where `glaze` is only asked for different kilns: used = { firing, tiles }, unused = ['glaze'].
 */
import type { AnswerValue, Answers, Question } from '../engine/types.js';

export type NextQuestion = (answers: Answers) => Question | null;

/** A path longer than this means `next` keeps asking (a rule-base bug), not a long interview. */
export const MAX_PATH = 500;

export interface Walk {
  /** Answers on the path, in asking order. */
  used: Answers;
  /** Ids of the answered questions on the path, in asking order. */
  order: string[];
  /** The first question on the path without an answer, or null when the path is complete. */
  pending: Question | null;
}

/** Walks while `known(id)` has an answer; stops at the first question it has none for. */
export function walk(next: NextQuestion, known: (id: string) => AnswerValue | undefined): Walk {
  const used: Answers = {};
  const order: string[] = [];
  for (;;) {
    const q = next({ ...used });
    if (q === null) return { used, order, pending: null };
    if (Object.prototype.hasOwnProperty.call(used, q.id)) {
      throw new Error(`the rule base asked '${q.id}' again after it was answered`);
    }
    if (order.length >= MAX_PATH) throw new Error(`the rule base asked more than ${MAX_PATH} questions`);
    const v = known(q.id);
    if (v === undefined) return { used, order, pending: q };
    used[q.id] = v;
    order.push(q.id);
  }
}

export interface AnswersCheck {
  /** The answers that are on the path. */
  used: Answers;
  /**
   * Given answers that are not on the path (they do not apply to these answers). Only known when
   * the walk reached the end of the path: while a choice or number question is missing, what
   * follows it is undecided and this list is empty.
   */
  unused: string[];
  /** The questions still to ask, as far as the given answers determine them (see missingAnswers). */
  missing: Question[];
}

/**
 * The questions still to ask. What follows a missing choice or number question depends on its
 * answer, so the list ends there; a missing text question (a label or name) never decides what
 * comes next, so the walk passes it with a stand-in and goes on. Once the listed answers are
 * given, further questions may follow: an empty list means the answers are complete.
 */
export function checkAnswers(next: NextQuestion, answers: Answers): AnswersCheck {
  const standIns = new Set<string>();
  const missing: Question[] = [];
  let w: Walk;
  const has = (id: string): boolean => Object.prototype.hasOwnProperty.call(answers, id);
  for (;;) {
    w = walk(next, (id) => (has(id) ? answers[id] : standIns.has(id) ? '(missing)' : undefined));
    if (w.pending === null) break;
    missing.push(w.pending);
    if (w.pending.type !== 'text') break;
    standIns.add(w.pending.id);
  }
  const used: Answers = {};
  for (const id of w.order) if (!standIns.has(id)) used[id] = answers[id];
  const ended = w.pending === null;
  const unused = ended ? Object.keys(answers).filter((id) => !w.order.includes(id)) : [];
  return { used, unused, missing };
}

export function missingAnswers(next: NextQuestion, answers: Answers): Question[] {
  return checkAnswers(next, answers).missing;
}
