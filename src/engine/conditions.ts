/**
 * Evaluating rule conditions: a closed vocabulary of operators looked up by name, never an
 * expression or eval. Each leaf evaluation can be recorded as a TraceStep (fact, operator,
 * expected, actual, result) so the tool can say why.
 *
 * A fact that was not asked, or an optional answer left blank (''), is "not given": every leaf
 * operator is false on it except `answered: false`. Example (an invented apiary study):
 *   { all: [ { fact: pairing, equals: natural-pairs }, { fact: n_pairs, lt: 40 } ] }
 * holds for { pairing: 'natural-pairs', n_pairs: 12 } and not for { pairing: 'none' }.
 */
import type { AnswerValue, TraceStep } from './types.js';
import type { Condition, LeafOperator, PredicateDef } from './model.js';

export type Facts = Map<string, AnswerValue>;

export interface EvalContext {
  predicates: Map<string, PredicateDef>;
  /** When given, each leaf evaluation is appended. */
  trace?: TraceStep[];
  /** The rule (or question guard) being evaluated, for the trace. */
  rule: string;
  /**
   * Predicate results already computed on the same facts (a speed-up for the completeness
   * check; the caller clears it whenever the facts change). Not used while tracing, so that the
   * trace of each rule shows its own steps.
   */
  memo?: Map<string, boolean>;
}

export function isGiven(v: AnswerValue | undefined): v is AnswerValue {
  return v !== undefined && v !== '';
}

const asNumber = (v: AnswerValue | undefined): number | undefined =>
  typeof v === 'number' && Number.isFinite(v) ? v : undefined;

/** Leaf operators by name. `expected` has been checked at load (type and allowed values). */
export const LEAF: Record<LeafOperator, (actual: AnswerValue | undefined, expected: unknown) => boolean> = {
  equals: (a, e) => isGiven(a) && a === e,
  in: (a, e) => isGiven(a) && Array.isArray(e) && e.includes(a),
  answered: (a, e) => isGiven(a) === e,
  gt: (a, e) => asNumber(a) !== undefined && (a as number) > (e as number),
  gte: (a, e) => asNumber(a) !== undefined && (a as number) >= (e as number),
  lt: (a, e) => asNumber(a) !== undefined && (a as number) < (e as number),
  lte: (a, e) => asNumber(a) !== undefined && (a as number) <= (e as number),
};

/**
 * Short-circuit evaluation (all stops at the first false, any at the first true). Under an odd
 * number of `not`s a leaf is traced as `not <operator>` with the negated result, so that every
 * trace step reads the way it counts toward the rule.
 */
export function evaluate(c: Condition, facts: Facts, ctx: EvalContext, negated = false): boolean {
  switch (c.op) {
    case 'all':
      return c.items.every((x) => evaluate(x, facts, ctx, negated));
    case 'any':
      return c.items.some((x) => evaluate(x, facts, ctx, negated));
    case 'not':
      return !evaluate(c.item, facts, ctx, !negated);
    case 'ref': {
      const p = ctx.predicates.get(c.name);
      // Dangling references are refused at load; treat a missing one as false defensively.
      if (!p) return false;
      if (ctx.memo && !ctx.trace) {
        const known = ctx.memo.get(c.name);
        if (known !== undefined) return known;
        const r = evaluate(p.when, facts, ctx);
        ctx.memo.set(c.name, r);
        return r;
      }
      return evaluate(p.when, facts, ctx, negated);
    }
    default: {
      const actual = facts.get(c.fact);
      const result = LEAF[c.op](actual, c.value);
      if (ctx.trace) {
        const step = { rule: ctx.rule, fact: c.fact, operator: negated ? `not ${c.op}` : c.op, expected: c.value, actual: isGiven(actual) ? actual : null, result: negated ? !result : result };
        // The same check reached again through a shared predicate adds nothing to the reasons.
        const seen = ctx.trace.some((t) => t.rule === step.rule && t.fact === step.fact && t.operator === step.operator && JSON.stringify(t.expected) === JSON.stringify(step.expected));
        if (!seen) ctx.trace.push(step);
      }
      return result;
    }
  }
}

/** Every fact a condition reads, following predicate references. */
export function factsOf(c: Condition, predicates: Map<string, PredicateDef>, seen = new Set<string>()): Set<string> {
  const out = new Set<string>();
  const walk = (x: Condition): void => {
    switch (x.op) {
      case 'all':
      case 'any':
        x.items.forEach(walk);
        return;
      case 'not':
        walk(x.item);
        return;
      case 'ref': {
        if (seen.has(x.name)) return;
        seen.add(x.name);
        const p = predicates.get(x.name);
        if (p) walk(p.when);
        seen.delete(x.name);
        return;
      }
      default:
        out.add(x.fact);
    }
  };
  walk(c);
  return out;
}

/** Every leaf of a condition (following references), for threshold collection. */
export function leavesOf(c: Condition, predicates: Map<string, PredicateDef>): Extract<Condition, { fact: string }>[] {
  const out: Extract<Condition, { fact: string }>[] = [];
  const seen = new Set<string>();
  const walk = (x: Condition): void => {
    if (x.op === 'all' || x.op === 'any') x.items.forEach(walk);
    else if (x.op === 'not') walk(x.item);
    else if (x.op === 'ref') {
      if (seen.has(x.name)) return;
      seen.add(x.name);
      const p = predicates.get(x.name);
      if (p) walk(p.when);
    } else out.push(x);
  };
  walk(c);
  return out;
}
