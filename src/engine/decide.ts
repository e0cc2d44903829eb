/**
 * The decision on a set of facts, stage by stage, without building any text: which
 * classification rule holds (the design), which procedure selection holds, which statements
 * (difference, hypotheses, scope) apply, and which warnings, cautions and conditions are shown.
 * `classify` builds the recommendation from it; `checkRuleBase` runs it on every answer path.
 */
import type { TraceStep } from './types.js';
import { evaluate, type Facts } from './conditions.js';
import type { ClassRule, Condition, DesignDef, DifferenceDef, HypothesesDef, NoteDef, RuleBase, ScopeDef, SelectionDef } from './model.js';

export interface Decision {
  rules: ClassRule[];
  design?: DesignDef;
  selections: SelectionDef[];
  differences: DifferenceDef[];
  hypotheses: HypothesesDef[];
  scope: ScopeDef[];
  warnings: NoteDef[];
  cautions: NoteDef[];
  /** Condition ids shown (from the procedure's list, each filtered by its own `when`). */
  conditions: string[];
  /** The stage that failed to give exactly one match, if any. */
  failed?: 'rules' | 'selections' | 'differences' | 'hypotheses' | 'scope';
}

function matches<T extends { id: string; when?: Condition }>(rb: RuleBase, items: T[], facts: Facts, memo: Map<string, boolean>, trace?: TraceStep[]): T[] {
  const out: T[] = [];
  for (const item of items) {
    // Record the trace only for items that hold: the trace explains the result, not every miss.
    const steps: TraceStep[] = [];
    const ok = item.when ? evaluate(item.when, facts, { predicates: rb.predicates, rule: item.id, trace: trace ? steps : undefined, memo }) : true;
    if (ok) {
      out.push(item);
      if (trace) trace.push(...steps);
    }
  }
  return out;
}

/**
 * Runs the stages on `facts` (effective answers plus derived facts); adds the stage facts
 * design_family, design_kind, procedure and fallback to `facts` as it goes.
 */
export function decide(rb: RuleBase, facts: Facts, trace?: TraceStep[]): Decision {
  const d: Decision = { rules: [], selections: [], differences: [], hypotheses: [], scope: [], warnings: [], cautions: [], conditions: [] };
  const memo = new Map<string, boolean>();
  d.rules = matches(rb, rb.rules, facts, memo, trace);
  if (d.rules.length !== 1) return { ...d, failed: 'rules' };
  d.design = rb.designs.get(d.rules[0].design);
  if (!d.design) return { ...d, failed: 'rules' };
  facts.set('design_family', d.design.family);
  facts.set('design_kind', d.design.kind);
  memo.clear();

  d.selections = matches(rb, rb.selections, facts, memo, trace);
  if (d.selections.length !== 1) return { ...d, failed: 'selections' };
  const sel = d.selections[0];
  if (sel.procedure) facts.set('procedure', sel.procedure);
  else facts.delete('procedure');
  if (sel.fallback) facts.set('fallback', sel.fallback);
  else facts.delete('fallback');
  memo.clear();

  d.differences = matches(rb, rb.differences, facts, memo, trace);
  if (d.differences.length !== 1) return { ...d, failed: 'differences' };
  d.hypotheses = matches(rb, rb.hypotheses, facts, memo, trace);
  if (d.hypotheses.length !== 1) return { ...d, failed: 'hypotheses' };
  d.scope = matches(rb, rb.scope, facts, memo, trace);
  if (d.scope.length !== 1) return { ...d, failed: 'scope' };
  d.warnings = matches(rb, rb.warnings, facts, memo, trace);
  d.cautions = matches(rb, rb.cautions, facts, memo, trace);

  const proc = sel.procedure ? rb.procedures.get(sel.procedure) : undefined;
  for (const id of proc?.conditions ?? []) {
    const c = rb.conditions.get(id);
    if (!c) continue;
    if (!c.when || evaluate(c.when, facts, { predicates: rb.predicates, rule: `condition:${id}`, memo })) d.conditions.push(id);
  }
  return d;
}
