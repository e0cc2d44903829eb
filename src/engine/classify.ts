/**
 * From answers to a recommendation: the design and why, the procedure and its pre-declared
 * sensitivity analysis, the conditions to check, the direction of subtraction, the hypotheses,
 * the scope of the conclusion, warnings, cautions, and the trace of evaluated conditions.
 * Everything it says comes from the rule base; this module only assembles it.
 */
import { InputError } from '../errors.js';
import type { Problem } from '../problems.js';
import type { AnswerValue, Answers, Recommendation, TraceStep } from './types.js';
import { answerProblem } from './ask.js';
import { decide, type Decision } from './decide.js';
import { effectiveAnswers, walkAnswers } from './facts.js';
import type { RuleBase } from './model.js';
import { fill } from './templates.js';
import type { Facts } from './conditions.js';

const has = (a: Answers, id: string): boolean => Object.prototype.hasOwnProperty.call(a, id);

/** Throws InputError when a given answer does not fit its question (only questions on the path). */
function checkValues(rb: RuleBase, answers: Answers): void {
  const problems: Problem[] = [];
  for (const q of walkAnswers(rb, answers).asked) {
    if (!has(answers, q.id)) continue;
    const why = answerProblem(q, answers[q.id]);
    if (why) problems.push({ code: 'unknown-value', message: why, hint: q.type === 'choice' ? `allowed: ${(q.choices ?? []).map((c) => c.value).join(', ')}` : undefined });
  }
  if (problems.length) throw new InputError(`${problems.length} answer${problems.length > 1 ? 's do' : ' does'} not fit the question`, problems);
}

export function classify(rb: RuleBase, answers: Answers): Recommendation {
  checkValues(rb, answers);
  const walked = walkAnswers(rb, answers);
  if (walked.missing.length) {
    const ids = walked.missing.map((q) => q.id);
    throw new InputError(
      `missing answers: ${ids.join(', ')}`,
      walked.missing.map((q) => ({ code: 'missing-key', message: `no answer for '${q.id}': ${q.text}` })),
    );
  }
  const facts = walked.facts;
  const trace: TraceStep[] = [];
  const d = decide(rb, facts, trace);
  if (d.failed) throw new InputError(`the rule base in ${rb.dir} does not decide these answers (${d.failed}: ${failedIds(d)}); run 'tandem rules check'`);
  return build(rb, d, facts, effectiveAnswers(walked), trace);
}

function failedIds(d: Decision): string {
  const list = d[d.failed as keyof Decision] as { id: string }[];
  return list.length === 0 ? 'none holds' : `${list.map((x) => x.id).join(' and ')} all hold`;
}

function build(rb: RuleBase, d: Decision, facts: Facts, answers: Answers, trace: TraceStep[]): Recommendation {
  const rule = d.rules[0];
  const design = d.design!;
  const sel = d.selections[0];
  const proc = sel.procedure ? rb.procedures.get(sel.procedure) : undefined;
  const plain = (name: string): AnswerValue | undefined => facts.get(name);
  // The procedure's parameter texts may name answers themselves; fill them first.
  const lookup = (name: string): AnswerValue | undefined => {
    if (name === 'param') return proc ? fill(proc.param.symbol, plain) : undefined;
    if (name === 'param_words') return proc ? fill(proc.param.words, plain) : undefined;
    return facts.get(name);
  };
  const t = (s: string): string => fill(s, lookup);
  const sentence = (s: string): string => {
    const x = t(s);
    return x.charAt(0).toUpperCase() + x.slice(1);
  };
  const hyp = d.hypotheses[0];
  const scope = d.scope[0];
  const margin = facts.get('margin');
  const instead = rule.instead ?? design.instead;
  return {
    design: {
      family: design.family,
      kind: design.kind,
      label: t(design.label),
      reasons: rule.reasons.map(t),
      ...(instead ? { instead: t(instead) } : {}),
      rule: rule.id,
    },
    procedure: {
      id: sel.procedure,
      name: proc ? t(proc.name) : t(sel.name ?? 'no two-condition procedure'),
      fallback: sel.fallback,
      ...(sel.fallbackWhy ? { fallbackWhy: t(sel.fallbackWhy) } : {}),
      nCounting: proc ? t(proc.nCounting) : '',
      df: proc ? t(proc.df) : '',
      estimate: proc ? t(proc.estimate) : '',
      alternative: hyp.alternative,
      ...(hyp.alternative === 'two-sided' && typeof margin === 'number' && facts.get('direction') === 'equivalence' ? { margin } : {}),
      ...(sel.confidence !== undefined ? { confidence: sel.confidence } : {}),
      ...(proc ? { applies: t(proc.applies), references: [...proc.references] } : {}),
      ...(sel.notes.length ? { notes: sel.notes.map(t) } : {}),
    },
    conditions: d.conditions.map((id) => {
      const c = rb.conditions.get(id)!;
      return { id, text: t(c.text), check: t(c.check), ...(c.basis ? { basis: c.basis } : {}) };
    }),
    difference: t(d.differences[0].text),
    hypotheses: {
      nullSymbols: t(hyp.nullSymbols),
      alternativeSymbols: t(hyp.alternativeSymbols),
      nullWords: sentence(hyp.nullWords),
      alternativeWords: sentence(hyp.alternativeWords),
    },
    scope: { causal: scope.causal, generalize: scope.generalize, text: t(scope.text) },
    warnings: d.warnings.map((w) => t(w.text)),
    cautions: d.cautions.map((c) => t(c.text)),
    trace,
    answers,
  };
}
