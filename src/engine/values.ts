/**
 * Representative answer values for the completeness check. A number question takes values on
 * both sides of every threshold a condition compares it with: directly, through min/max derived
 * facts, and through ratios (where the threshold moves with the other operand, e.g. a sample
 * fraction above 0.1 of a population). Example: `n_pairs` read as `gte 40` and `lte 5` gives
 * 39, 40, 5 and 6, plus blank when the question is optional.
 */
import { answerProblem } from './ask.js';
import { leavesOf, type Facts } from './conditions.js';
import type { Condition, QuestionDef, RuleBase } from './model.js';
import type { AnswerValue } from './types.js';

interface RatioThreshold {
  num: string;
  den: string;
  t: number;
  op: string;
}
interface Threshold {
  t: number;
  op: string;
}

export function allConditions(rb: RuleBase): Condition[] {
  const out: (Condition | undefined)[] = [
    ...rb.questions.map((q) => q.guard),
    ...[...rb.predicates.values()].map((p) => p.when),
    ...rb.rules.map((r) => r.when),
    ...rb.selections.map((s) => s.when),
    ...[...rb.conditions.values()].map((c) => c.when),
    ...[...rb.differences, ...rb.hypotheses, ...rb.scope, ...rb.warnings, ...rb.cautions].map((s) => s.when),
  ];
  return out.filter((c): c is Condition => c !== undefined);
}

export type Thresholds = ReturnType<typeof thresholds>;

/** Thresholds per number fact, pushed through min/max to their arguments; ratios kept apart. */
export function thresholds(rb: RuleBase): { direct: Map<string, Threshold[]>; ratios: RatioThreshold[] } {
  const direct = new Map<string, Threshold[]>();
  const ratios: RatioThreshold[] = [];
  const derived = new Map(rb.derived.map((d) => [d.id, d]));
  const push = (fact: string, t: number, op: string): void => {
    const d = derived.get(fact);
    if (d?.op === 'ratio') ratios.push({ num: d.args[0], den: d.args[1], t, op: 'equals' });
    else if (d) d.args.forEach((a) => push(a, t, op));
    else {
      if (!direct.has(fact)) direct.set(fact, []);
      direct.get(fact)!.push({ t, op });
    }
  };
  for (const c of allConditions(rb)) {
    for (const leaf of leavesOf(c, rb.predicates)) {
      if (['gt', 'gte', 'lt', 'lte', 'equals'].includes(leaf.op) && typeof leaf.value === 'number') push(leaf.fact, leaf.value, leaf.op);
    }
  }
  return { direct, ratios };
}

/**
 * Values on both sides of a threshold: for `gte t` / `lt t` the last value below t and t
 * itself; for `gt t` / `lte t` t itself and the first value above; for `equals t` all three.
 */
function around(t: number, integer: boolean, op: string): number[] {
  const d = integer ? 1 : Math.max(1e-6, Math.abs(t) * 1e-6);
  const lo = integer ? Math.ceil(t) : t;
  const hi = integer ? Math.floor(t) : t;
  if (op === 'gte' || op === 'lt') return [lo - d, lo];
  if (op === 'gt' || op === 'lte') return [hi, hi + d];
  return integer && !Number.isInteger(t) ? [Math.floor(t), Math.ceil(t)] : [t - d, t, t + d];
}

export function candidates(q: QuestionDef, facts: Facts, th: Thresholds): AnswerValue[] {
  if (q.type === 'choice') return (q.choices ?? []).map((c) => c.value);
  const blank: AnswerValue[] = q.optional ? [''] : [];
  if (q.type === 'text') return ['(example)', ...blank];
  const raw = new Set<number>();
  for (const { t, op } of th.direct.get(q.id) ?? []) around(t, !!q.integer, op).forEach((v) => raw.add(v));
  const num = (id: string): number | undefined => {
    const v = facts.get(id);
    return typeof v === 'number' ? v : undefined;
  };
  for (const r of th.ratios) {
    const a = num(r.num);
    const b = num(r.den);
    // A ratio's threshold moves with the other operand, so both sides of it are taken.
    if (r.den === q.id && a !== undefined && r.t !== 0) around(a / r.t, !!q.integer, r.op).forEach((v) => raw.add(v));
    if (r.num === q.id && b !== undefined) around(b * r.t, !!q.integer, r.op).forEach((v) => raw.add(v));
  }
  const ok = [...raw].filter((v) => answerProblem(q, v) === null).sort((x, y) => x - y);
  if (ok.length === 0) {
    const typical = q.min === undefined ? 1 : q.minExclusive ? q.min + 1 : q.min;
    ok.push(answerProblem(q, typical) === null ? typical : (q.max ?? 1));
  }
  return [...ok, ...blank];
}
