/**
 * The completeness check: enumerate every reachable answer path and prove that each ends in
 * exactly one design rule, one procedure selection, one difference statement, one hypotheses
 * entry and one scope entry (no none, no two). Choice questions branch on every value; number
 * questions take representative values around each threshold a condition compares them with
 * (also through derived facts); text questions take one stand-in value, plus blank when optional.
 * Rules never matched, questions never asked and catalogue entries never used are reported too.
 */
import type { Problem } from '../problems.js';
import type { Answers } from './types.js';
import { evaluate, factsOf } from './conditions.js';
import { allConditions, candidates, thresholds } from './values.js';
import { decide, type Decision } from './decide.js';
import { refreshDerived } from './facts.js';
import type { Condition, Pos, QuestionDef, RuleBase } from './model.js';
import type { Facts } from './conditions.js';

export interface CheckReport {
  files: number;
  questions: number;
  designs: number;
  procedures: number;
  rules: number;
  /** Answer paths enumerated. */
  paths: number;
  /** Paths ending in each design kind, and in each primary procedure ('none' for no procedure). */
  outcomes: Record<string, number>;
  procedureCounts: Record<string, number>;
  problems: Problem[];
}

/** Beyond this many paths the check stops and reports it (a rule base grown out of hand). */
export const MAX_PATHS = 2_000_000;
const EXAMPLES_PER_STAGE = 12;

type Stage = NonNullable<Decision['failed']>;

/**
 * The facts that can change which question comes next or which exclusive entry holds (rules,
 * selections, differences, hypotheses, scope), followed through predicates and derived facts.
 * A question outside this set (a label, the people/safety question, a margin) changes only
 * wording, warnings, cautions or the conditions listed, so its values are rotated across paths
 * instead of multiplied: every value still appears, and the proof of "exactly one" is unchanged.
 */
export function decidingFacts(rb: RuleBase): Set<string> {
  const conds: (Condition | undefined)[] = [
    ...rb.questions.map((q) => q.guard),
    ...rb.rules.map((r) => r.when),
    ...rb.selections.map((x) => x.when),
    ...[...rb.differences, ...rb.hypotheses, ...rb.scope].map((x) => x.when),
  ];
  const out = new Set<string>();
  for (const c of conds) if (c) for (const f of factsOf(c, rb.predicates)) out.add(f);
  const derived = new Map(rb.derived.map((d) => [d.id, d]));
  const expand = (f: string): void => derived.get(f)?.args.forEach((a) => {
    if (!out.has(a)) {
      out.add(a);
      expand(a);
    }
  });
  [...out].forEach(expand);
  return out;
}

export function checkRuleBase(rb: RuleBase): CheckReport {
  const th = thresholds(rb);
  const deciding = decidingFacts(rb);
  const readBy = (xs: { when?: Condition }[]): Set<string> => new Set(xs.flatMap((x) => (x.when ? [...factsOf(x.when, rb.predicates)] : [])));
  const stageFacts: Record<Stage, Set<string>> = {
    rules: readBy(rb.rules),
    selections: readBy(rb.selections),
    differences: readBy(rb.differences),
    hypotheses: readBy(rb.hypotheses),
    scope: readBy(rb.scope),
  };
  const rotation = new Map<string, number>();
  const asked = new Set<string>();
  const used = new Set<string>();
  const outcomes: Record<string, number> = {};
  const procedureCounts: Record<string, number> = {};
  const failures = new Map<string, { stage: Stage; matched: { id: string; pos: Pos }[]; example: Answers; count: number }>();
  let paths = 0;
  let stopped = false;

  const leaf = (answers: Answers, facts: Facts, askedHere: QuestionDef[]): void => {
    paths++;
    askedHere.forEach((q) => asked.add(q.id));
    const d = decide(rb, facts);
    const mark = (xs: { id: string }[], prefix: string): void => xs.forEach((x) => used.add(prefix + x.id));
    mark(d.rules, 'rule:');
    mark(d.selections, 'rule:');
    mark(d.differences, 'rule:');
    mark(d.hypotheses, 'rule:');
    mark(d.scope, 'rule:');
    mark(d.warnings, 'rule:');
    mark(d.cautions, 'rule:');
    d.conditions.forEach((c) => used.add('condition:' + c));
    if (d.design) used.add('design:' + d.design.kind);
    if (d.failed) {
      const matched = (d[d.failed] as { id: string; pos: Pos }[]).map((x) => ({ id: x.id, pos: x.pos }));
      // Paths that look the same to the failing stage (same values of the facts its entries
      // read) are one problem; the first is shown as the example and the rest counted.
      const seenBy = [...stageFacts[d.failed]].map((f) => `${f}=${String(facts.get(f) ?? '')}`).join(',');
      const key = `${d.failed}|${matched.map((m) => m.id).join(',')}|${seenBy}`;
      const f = failures.get(key);
      if (f) f.count++;
      else failures.set(key, { stage: d.failed, matched, example: { ...answers }, count: 1 });
      return;
    }
    const sel = d.selections[0];
    if (sel.procedure) used.add('procedure:' + sel.procedure);
    if (sel.fallback) used.add('procedure:' + sel.fallback);
    outcomes[d.design!.kind] = (outcomes[d.design!.kind] ?? 0) + 1;
    const p = sel.procedure ?? 'none';
    procedureCounts[p] = (procedureCounts[p] ?? 0) + 1;
  };

  // Depth-first over the questions in asking order, carrying the facts along the path (the same
  // walk as walkAnswers, done incrementally so that no path is re-walked from the start).
  const answers: Answers = {};
  const facts: Facts = new Map();
  const askedHere: QuestionDef[] = [];
  const dfs = (from: number): void => {
    if (stopped) return;
    const memo = new Map<string, boolean>();
    let i = from;
    while (i < rb.questions.length) {
      const g = rb.questions[i].guard;
      if (!g || evaluate(g, facts, { predicates: rb.predicates, rule: 'check', memo })) break;
      i++;
    }
    if (i >= rb.questions.length) return leaf(answers, new Map(facts), askedHere);
    if (paths >= MAX_PATHS) {
      stopped = true;
      return;
    }
    const q = rb.questions[i];
    let values = candidates(q, facts, th);
    if (!deciding.has(q.id)) {
      const k = rotation.get(q.id) ?? 0;
      rotation.set(q.id, k + 1);
      values = [values[k % values.length]];
    }
    askedHere.push(q);
    for (const v of values) {
      answers[q.id] = v;
      facts.set(q.id, v);
      refreshDerived(rb, facts);
      dfs(i + 1);
    }
    askedHere.pop();
    delete answers[q.id];
    facts.delete(q.id);
    refreshDerived(rb, facts);
  };
  dfs(0);

  const problems: Problem[] = [];
  const first = rb.questions[0]?.pos ?? { file: rb.files[0] ?? rb.dir, line: 1, col: 1 };
  if (stopped) problems.push({ ...first, code: 'incomplete', message: `more than ${MAX_PATHS} answer paths: the check stopped before covering them all` });
  problems.push(...failureProblems(rb, failures));
  for (const q of rb.questions) if (!asked.has(q.id)) problems.push({ ...q.pos, code: 'never-asked', message: `question '${q.id}' is never asked on any answer path`, hint: 'its ask_when never holds' });
  const unreached = (prefix: string, xs: { id: string; pos: Pos }[], what: string): void => {
    for (const x of xs) if (!used.has(prefix + x.id)) problems.push({ ...x.pos, code: 'unreachable', message: `${what} '${x.id}' never applies on any answer path` });
  };
  unreached('design:', [...rb.designs.values()].map((d) => ({ id: d.kind, pos: d.pos })), 'design');
  unreached('rule:', rb.rules, 'rule');
  unreached('rule:', rb.selections, 'procedure selection');
  unreached('rule:', rb.differences, 'difference statement');
  unreached('rule:', rb.hypotheses, 'hypotheses entry');
  unreached('rule:', rb.scope, 'scope entry');
  unreached('rule:', rb.warnings, 'warning');
  unreached('rule:', rb.cautions, 'caution');
  unreached('condition:', [...rb.conditions.values()], 'condition');
  unreached('procedure:', [...rb.procedures.values()], 'procedure');
  for (const p of rb.predicates.values()) {
    const refs = allConditions(rb).some((c) => JSON.stringify(c, (k, v) => (k === 'pos' ? undefined : v)).includes(`"name":"${p.id}"`));
    if (!refs) problems.push({ ...p.pos, code: 'unreachable', message: `predicate '${p.id}' is never referred to` });
  }
  return {
    files: rb.files.length,
    questions: rb.questions.length,
    designs: rb.designs.size,
    procedures: rb.procedures.size,
    rules: rb.rules.length,
    paths,
    outcomes,
    procedureCounts,
    problems,
  };
}

function describe(a: Answers): string {
  return Object.entries(a)
    .filter(([, v]) => v !== '(example)')
    .map(([k, v]) => `${k}=${v === '' ? '(blank)' : String(v)}`)
    .join(', ');
}

const STAGE_WORDS: Record<Stage, string> = {
  rules: 'classification rule',
  selections: 'procedure selection',
  differences: 'difference statement',
  hypotheses: 'hypotheses entry',
  scope: 'scope entry',
};

function failureProblems(rb: RuleBase, failures: Map<string, { stage: Stage; matched: { id: string; pos: Pos }[]; example: Answers; count: number }>): Problem[] {
  const out: Problem[] = [];
  const perStage = new Map<Stage, number>();
  for (const f of failures.values()) {
    const n = perStage.get(f.stage) ?? 0;
    perStage.set(f.stage, n + 1);
    if (n >= EXAMPLES_PER_STAGE) continue;
    const more = f.count > 1 ? ` (and ${f.count - 1} more path${f.count > 2 ? 's' : ''} like it)` : '';
    const what = STAGE_WORDS[f.stage];
    if (f.matched.length === 0) {
      const section = { rules: rb.rules, selections: rb.selections, differences: rb.differences, hypotheses: rb.hypotheses, scope: rb.scope }[f.stage];
      const pos = section[0]?.pos ?? { file: rb.files[0] ?? rb.dir, line: 1, col: 1 };
      out.push({ ...pos, code: 'incomplete', message: `no ${what} holds for: ${describe(f.example)}${more}`, hint: `add a ${what} for these answers` });
    } else {
      const [a, ...rest] = f.matched;
      const others = rest.map((r) => `'${r.id}' (${r.pos.file}:${r.pos.line})`).join(', ');
      out.push({ ...a.pos, code: 'ambiguous', message: `${what}s '${a.id}' and ${others} all hold for: ${describe(f.example)}${more}`, hint: 'make their conditions exclusive' });
    }
  }
  for (const [stage, n] of perStage) {
    if (n > EXAMPLES_PER_STAGE) out.push({ file: rb.files[0] ?? rb.dir, code: 'incomplete', message: `${n - EXAMPLES_PER_STAGE} more distinct ${STAGE_WORDS[stage]} failures not listed` });
  }
  return out;
}
