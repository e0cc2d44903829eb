/**
 * Building the engine's rule base from the parsed rule files, with every cross-file check:
 * duplicate ids, dangling references (predicates, designs, procedures, conditions, facts,
 * placeholders), conditions that read facts not known yet, and question guards that read answers
 * given only later. All problems are collected, each with its file, line and column.
 */
import type { Problem } from '../problems.js';
import type { LoadedYaml } from '../yaml/load.js';
import { PROCEDURE_IDS, type ProcedureId } from '../stats/types.js';
import type { Condition, DerivedDef, DesignDef, Pos, QuestionDef, RuleBase } from '../engine/model.js';
import { PROCEDURE_PLACEHOLDERS, STAGE_FACTS } from '../engine/model.js';
import { factsOf } from '../engine/conditions.js';
import { PLACEHOLDER, placeholders } from '../engine/templates.js';
import { parseCondition, posAt, type FactInfo, type ParseContext } from './conditions.js';
import { buildItems, type Raw, type Item } from './items.js';

type Section = 'questions' | 'predicates' | 'derived' | 'designs' | 'rules' | 'procedures' | 'selections' | 'conditions' | 'differences' | 'hypotheses' | 'scope' | 'warnings' | 'cautions';
export const SECTIONS: Section[] = ['questions', 'predicates', 'derived', 'designs', 'rules', 'procedures', 'selections', 'conditions', 'differences', 'hypotheses', 'scope', 'warnings', 'cautions'];

export interface ParsedFile {
  loaded: LoadedYaml;
  value: Record<string, unknown>;
}

export function buildRuleBase(dir: string, files: ParsedFile[]): { rb: RuleBase; problems: Problem[] } {
  const problems: Problem[] = [];
  const items = (section: Section): Item[] =>
    files.flatMap((f) => ((f.value[section] as Raw[] | undefined) ?? []).map((raw, i) => ({ raw, loaded: f.loaded, path: [section, i], pos: posAt(f.loaded, [section, i]) })));
  const problem = (code: Problem['code'], it: Item, sub: (string | number)[], message: string, hint?: string, key = false): void => {
    const p = posAt(it.loaded, [...it.path, ...sub], key);
    problems.push({ code, file: p.file, line: p.line, col: p.col, message, hint });
  };

  // Ids must be unique within a namespace; the first definition wins and later ones are reported.
  const seen = new Map<string, Pos>();
  const unique = (namespace: string, id: string, it: Item, key = 'id'): boolean => {
    const k = `${namespace}\u0000${id}`;
    const first = seen.get(k);
    if (first) {
      problem('duplicate-id', it, [key], `duplicate ${namespace} id '${id}'`, `first defined at ${first.file}:${first.line}:${first.col}`);
      return false;
    }
    seen.set(k, it.pos);
    return true;
  };

  const b = buildItems({ problem, unique, problems });
  const questionItems = items('questions');
  const questions = b.questions(questionItems);
  const derived = b.derived(items('derived'), questions);
  const designs = b.designs(items('designs'));
  const predicateIds = new Set(items('predicates').map((it) => String(it.raw.id)));

  const facts = new Map<string, FactInfo>();
  for (const q of questions) facts.set(q.id, { stage: 0, numeric: q.type === 'number', question: q });
  for (const d of derived) facts.set(d.id, { stage: 0, numeric: true });
  facts.set('design_family', { stage: STAGE_FACTS.design_family, numeric: false, values: ['paired', 'independent', 'other'] });
  facts.set('design_kind', { stage: STAGE_FACTS.design_kind, numeric: false, values: [...designs.keys()] });
  facts.set('procedure', { stage: STAGE_FACTS.procedure, numeric: false, values: PROCEDURE_IDS });
  facts.set('fallback', { stage: STAGE_FACTS.fallback, numeric: false, values: PROCEDURE_IDS });

  const cond = (it: Item, key: string, maxStage: 0 | 1 | 2, where: string): Condition | undefined => {
    if (it.raw[key] === undefined) return undefined;
    const ctx: ParseContext = { loaded: it.loaded, facts, predicates: predicateIds, problems, maxStage, where };
    return parseCondition(it.raw[key], [...it.path, key], ctx);
  };

  const predicates = b.predicates(items('predicates'), (it) => cond(it, 'when', 2, `predicate '${String(it.raw.id)}'`));
  for (const q of questions) {
    const it = questionItems.find((x) => x.pos === q.pos);
    if (it) q.guard = cond(it, 'ask_when', 0, `the ask_when of question '${q.id}'`);
  }
  const rules = b.rules(items('rules'), designs, (it) => cond(it, 'when', 0, `rule '${String(it.raw.id)}'`));
  const procedures = b.procedures(items('procedures'));
  const selections = b.selections(items('selections'), procedures, (it) => cond(it, 'when', 1, `selection '${String(it.raw.id)}'`));
  const conditions = b.conditionsToCheck(items('conditions'), (it) => cond(it, 'when', 2, `condition '${String(it.raw.id)}'`));
  const st = (it: Item, what: string): Condition | undefined => cond(it, 'when', 2, `${what} '${String(it.raw.id)}'`);
  const differences = b.differences(items('differences'), (it) => st(it, 'difference'));
  const hypotheses = b.hypotheses(items('hypotheses'), (it) => st(it, 'hypotheses'));
  const scope = b.scope(items('scope'), (it) => st(it, 'scope'));
  const warnings = b.notes(items('warnings'), 'warning', (it) => st(it, 'warning'));
  const cautions = b.notes(items('cautions'), 'caution', (it) => st(it, 'caution'));

  const procedureItems = items('procedures');
  for (const p of procedures.values()) {
    const it = procedureItems.find((x) => x.pos.file === p.pos.file && x.pos.line === p.pos.line)!;
    p.conditions.forEach((c, i) => {
      if (!conditions.has(c)) problem('dangling-ref', it, ['conditions', i], `procedure '${p.id}' lists unknown condition '${c}'`, `known: ${[...conditions.keys()].join(', ')}`);
    });
  }

  const rb: RuleBase = { dir, files: files.map((f) => f.loaded.file), questions, predicates, derived, designs, rules, procedures, selections, conditions, differences, hypotheses, scope, warnings, cautions };
  checkStages(rb, problems);
  checkPredicateCycles(rb, problems);
  checkGuardOrder(rb, problems);
  checkPlaceholders(rb, files, problems);
  return { rb, problems };
}

/** Conditions that reach later-stage facts through a predicate. */
function checkStages(rb: RuleBase, problems: Problem[]): void {
  const stageOf = (c: Condition | undefined): number => Math.max(0, ...[...(c ? factsOf(c, rb.predicates) : [])].map((f) => STAGE_FACTS[f] ?? 0));
  const report = (c: Condition | undefined, max: number, what: string): void => {
    if (c && stageOf(c) > max) problems.push({ ...c.pos, code: 'dangling-ref', message: `${what} reads ${max === 0 ? 'the design or procedure' : 'the procedure'} through a predicate, which is not known yet at that point` });
  };
  for (const q of rb.questions) report(q.guard, 0, `the ask_when of question '${q.id}'`);
  for (const r of rb.rules) report(r.when, 0, `rule '${r.id}'`);
  for (const s of rb.selections) report(s.when, 1, `selection '${s.id}'`);
}

function checkPredicateCycles(rb: RuleBase, problems: Problem[]): void {
  const state = new Map<string, 'open' | 'done'>();
  const visit = (id: string, c: Condition): boolean => {
    if (c.op === 'all' || c.op === 'any') return c.items.every((x) => visit(id, x));
    if (c.op === 'not') return visit(id, c.item);
    if (c.op !== 'ref') return true;
    const s = state.get(c.name);
    if (s === 'open') {
      problems.push({ ...c.pos, code: 'dangling-ref', message: `predicate '${id}' refers back to '${c.name}' (a cycle)` });
      return false;
    }
    if (s === 'done') return true;
    const p = rb.predicates.get(c.name);
    if (!p) return true;
    state.set(c.name, 'open');
    const ok = visit(c.name, p.when);
    state.set(c.name, 'done');
    return ok;
  };
  for (const p of rb.predicates.values()) {
    if (state.get(p.id) === 'done') continue;
    state.set(p.id, 'open');
    if (!visit(p.id, p.when)) {
      // Drop the cyclic predicate so evaluation cannot loop.
      rb.predicates.delete(p.id);
    }
    state.set(p.id, 'done');
  }
}

/** A guard may read only answers to questions asked before it (directly or through derived facts). */
function checkGuardOrder(rb: RuleBase, problems: Problem[]): void {
  const index = new Map(rb.questions.map((q, i) => [q.id, i]));
  const derived = new Map<string, DerivedDef>(rb.derived.map((d) => [d.id, d]));
  const sources = (fact: string, out = new Set<string>()): Set<string> => {
    const d = derived.get(fact);
    if (d) d.args.forEach((a) => sources(a, out));
    else out.add(fact);
    return out;
  };
  rb.questions.forEach((q, i) => {
    if (!q.guard) return;
    for (const f of factsOf(q.guard, rb.predicates)) {
      for (const s of sources(f)) {
        const j = index.get(s);
        if (j !== undefined && j >= i) {
          problems.push({ ...q.guard.pos, code: 'dangling-ref', message: `the ask_when of question '${q.id}' reads '${s}', which is asked ${j === i ? 'by this question itself' : 'later'}`, hint: 'a question may depend only on questions listed before it' });
        }
      }
    }
  });
}

/** Placeholders in texts must name a question, a derived fact, a stage fact or param/param_words. */
function checkPlaceholders(rb: RuleBase, files: ParsedFile[], problems: Problem[]): void {
  const known = new Set<string>([...rb.questions.map((q) => q.id), ...rb.derived.map((d) => d.id), ...Object.keys(STAGE_FACTS), ...PROCEDURE_PLACEHOLDERS]);
  const order = new Map(rb.questions.map((q, i) => [q.id, i]));
  // A question's text may name an answer given before it, with a default for when it is blank or
  // not yet known ("{first_label|the first condition}"); nothing else.
  const questionAt = (path: (string | number)[]): number | undefined => (path[0] === 'questions' && typeof path[1] === 'number' ? path[1] : undefined);
  const fitsQuestion = (text: string, name: string, path: (string | number)[], f: ParsedFile): boolean => {
    const i = questionAt(path);
    const raw = i === undefined ? undefined : (f.value.questions as { id?: unknown }[] | undefined)?.[i];
    const own = raw && typeof raw.id === 'string' ? order.get(raw.id) : undefined;
    const ref = order.get(name);
    const withDefault = [...text.matchAll(PLACEHOLDER)].every((m) => m[1] !== name || m[2] !== undefined);
    return own !== undefined && ref !== undefined && ref < own && withDefault;
  };
  const walk = (v: unknown, path: (string | number)[], f: ParsedFile, inQuestion: boolean): void => {
    if (typeof v === 'string') {
      for (const name of placeholders(v)) {
        if (inQuestion ? !fitsQuestion(v, name, path, f) : !known.has(name)) {
          const p = posAt(f.loaded, path);
          problems.push({
            code: 'dangling-ref',
            file: p.file,
            line: p.line,
            col: p.col,
            message: inQuestion ? `placeholder '{${name}}' in a question must name an earlier question and give a default` : `unknown placeholder '{${name}}'`,
            hint: inQuestion ? 'e.g. {first_label|the first condition}, where first_label is asked before this question' : 'a placeholder names a question id, a derived fact, design_family, design_kind, procedure, fallback, param or param_words',
          });
        }
      }
    } else if (Array.isArray(v)) v.forEach((x, i) => walk(x, [...path, i], f, inQuestion));
    else if (typeof v === 'object' && v !== null) {
      for (const [k, x] of Object.entries(v)) if (!['when', 'ask_when'].includes(k)) walk(x, [...path, k], f, inQuestion);
    }
  };
  for (const f of files) for (const s of SECTIONS) if (f.value[s] !== undefined) walk(f.value[s], [s], f, s === 'questions');
}

export type { DesignDef, QuestionDef, ProcedureId };
