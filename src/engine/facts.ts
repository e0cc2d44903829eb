/**
 * From raw answers to the facts the rules read. Only answers to questions that are actually asked
 * count ("effective" answers): when an earlier answer changes so that a later question no longer
 * applies, its stale answer is ignored instead of steering a rule. Derived facts are computed with
 * a closed set of operations (max, min, ratio) from the effective answers.
 *
 * Example (an invented orchard survey): n_pairs = 30 and population_size = 200 give
 * largest_sample = max(n_pairs, n_first, n_second) = 30 and sample_fraction = 30 / 200 = 0.15.
 */
import type { AnswerValue, Answers } from './types.js';
import { evaluate, isGiven, type Facts } from './conditions.js';
import type { DerivedDef, QuestionDef, RuleBase } from './model.js';

const has = (a: Answers, id: string): boolean => Object.prototype.hasOwnProperty.call(a, id);

export function computeDerived(d: DerivedDef, facts: Facts): AnswerValue | undefined {
  const nums = d.args.map((a) => facts.get(a)).map((v) => (typeof v === 'number' && Number.isFinite(v) ? v : undefined));
  if (d.op === 'ratio') {
    const [a, b] = nums;
    return a !== undefined && b !== undefined && b !== 0 ? a / b : undefined;
  }
  const given = nums.filter((v): v is number => v !== undefined);
  if (given.length === 0) return undefined;
  return d.op === 'max' ? Math.max(...given) : Math.min(...given);
}

export function refreshDerived(rb: RuleBase, facts: Facts): void {
  for (const d of rb.derived) {
    const v = computeDerived(d, facts);
    if (v === undefined) facts.delete(d.id);
    else facts.set(d.id, v);
  }
}

export interface Walked {
  /** Effective answers and derived facts. */
  facts: Facts;
  /** Questions whose guard holds, in asking order. */
  asked: QuestionDef[];
  /** The first asked question without an answer, if any. */
  next: QuestionDef | null;
  /** Asked, not optional, and not answered. */
  missing: QuestionDef[];
}

/**
 * Walks the questions in order. With `stopAtFirstGap`, stops at the first unanswered question
 * (what follows may depend on it); otherwise carries on to list every missing required answer
 * that the given answers already determine.
 */
export function walkAnswers(rb: RuleBase, answers: Answers, stopAtFirstGap = false): Walked {
  const facts: Facts = new Map();
  const asked: QuestionDef[] = [];
  const missing: QuestionDef[] = [];
  let next: QuestionDef | null = null;
  // Predicate results stay valid until the next answer is added to the facts.
  const memo = new Map<string, boolean>();
  for (const q of rb.questions) {
    if (q.guard && !evaluate(q.guard, facts, { predicates: rb.predicates, rule: `ask:${q.id}`, memo })) continue;
    asked.push(q);
    if (has(answers, q.id)) {
      const v = answers[q.id];
      if (v !== undefined && v !== null) facts.set(q.id, v);
      refreshDerived(rb, facts);
      memo.clear();
      continue;
    }
    if (next === null) next = q;
    if (!q.optional) missing.push(q);
    if (stopAtFirstGap) break;
  }
  return { facts, asked, next, missing };
}

/** The effective answers (asked questions only) as a plain object, in asking order. */
export function effectiveAnswers(w: Walked): Answers {
  const out: Answers = {};
  for (const q of w.asked) {
    const v = w.facts.get(q.id);
    if (v !== undefined) out[q.id] = v;
  }
  return out;
}

export { isGiven };
