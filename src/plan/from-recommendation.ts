/**
 * Turning a recommendation into an analysis plan (pure: no clock, no files). The study labels
 * come from the fixed interview answers (unit, outcome, outcome_unit, first_label, second_label);
 * the data mapping, when none is given, is a default derived from the procedure's layout with
 * column names made from the labels, for the user to edit.
 *
 * Example: a bakery compares crust moisture of loaves baked in "Oven A" and "Oven B", each loaf
 * split in two (paired, paired t). The default mapping is
 *   { layout: wide, id: id, first: oven_a, second: oven_b, pairBy: id }.
 */
import { InputError } from '../errors.js';
import type { Answers, Recommendation } from '../engine/types.js';
import type { ProcedureId } from '../stats/types.js';
import { VERSION } from '../version.js';
import { PROCEDURES } from './procedures.js';
import { PLAN_FORMAT, type Plan } from './types.js';

export type PlanData = Plan['data'];

export interface PlanOptions {
  title?: string;
  /** A data mapping to use instead of the default (e.g. from an answers file's `data:` block). */
  data?: PlanData;
  /** When the plan was written (ISO 8601); left out when not given, to keep this function pure. */
  created?: string;
}

/** A column name from a label: lower case, letters and digits joined by underscores. */
export function slugify(label: string, fallback: string): string {
  const s = label
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '_')
    .replace(/^_+|_+$/g, '');
  return s || fallback;
}

function text(answers: Answers, id: string): string | undefined {
  const v = answers[id];
  if (v === undefined || v === null) return undefined;
  const s = String(v).trim();
  return s === '' ? undefined : s;
}

/** The default data mapping for a procedure, with column names derived from the labels. */
export function defaultDataMapping(procedure: ProcedureId, study: Plan['study']): PlanData {
  let first = slugify(study.first, 'first');
  let second = slugify(study.second, 'second');
  if (first === second) {
    first = `${first}_1`;
    second = `${second}_2`;
  }
  const id = [first, second].includes('id') ? 'unit_id' : 'id';
  const layout = PROCEDURES[procedure].layouts[0];
  switch (layout) {
    case 'crossover':
      return {
        layout: 'crossover',
        id,
        sequence: 'sequence',
        firstThenSecond: `${first}-first`,
        secondThenFirst: `${second}-first`,
        period1: 'period_1',
        period2: 'period_2',
      };
    case 'groups': {
      const value = slugify(study.outcome, 'value');
      return { layout: 'groups', group: value === 'group' ? 'condition' : 'group', value, firstLevel: study.first, secondLevel: study.second };
    }
    default:
      return { layout: 'wide', id, first, second, pairBy: 'id' };
  }
}

/**
 * The plan for a recommendation. Throws InputError when the design is outside a two-condition
 * comparison (there is no procedure to plan).
 */
export function planFromRecommendation(rec: Recommendation, opts: PlanOptions = {}): Plan {
  const id = rec.procedure.id;
  if (rec.design.family === 'other' || id === null) {
    const instead = rec.design.instead ? ` ${rec.design.instead}` : '';
    throw new InputError(`no plan can be written: ${rec.design.label} is outside a two-condition comparison.${instead}`);
  }
  const a = rec.answers;
  const outcomeUnit = text(a, 'outcome_unit');
  const facts = PROCEDURES[id];
  const study: Plan['study'] = {
    unit: text(a, 'unit') ?? 'unit',
    outcome: text(a, 'outcome') ?? 'outcome',
    ...(outcomeUnit ? { outcomeUnit } : {}),
    first: text(a, 'first_label') ?? 'first condition',
    second: text(a, 'second_label') ?? 'second condition',
    // Binary outcomes: the result that counts as the event, when the interview named it (without
    // it the data layer recognises 0/1, yes/no and true/false, and asks otherwise).
    ...(facts.binary && text(a, 'event') ? { event: text(a, 'event') } : {}),
  };
  // A margin given by the recommendation is kept whatever the procedure (binary procedures judge
  // equivalence by their interval); an equivalence procedure may also take it from the answers.
  const margin = rec.procedure.margin ?? (facts.equivalence ? numberAnswer(a, 'margin') : undefined);
  const plan: Plan = {
    format: PLAN_FORMAT,
    title: opts.title?.trim() || `${study.first} versus ${study.second}: ${study.outcome}`,
    createdBy: `tandem ${VERSION}`,
    ...(opts.created ? { created: opts.created } : {}),
    study,
    design: { family: rec.design.family, kind: rec.design.kind, reasons: [...rec.design.reasons] },
    difference: rec.difference,
    procedure: {
      id,
      alternative: rec.procedure.alternative,
      confidence: rec.procedure.confidence ?? 0.95,
      nullValue: 0,
      ...(margin !== undefined ? { margin } : {}),
    },
    sensitivity: rec.procedure.fallback ? { id: rec.procedure.fallback, why: rec.procedure.fallbackWhy ?? '' } : null,
    hypotheses: { ...rec.hypotheses },
    data: opts.data ? structuredClone(opts.data) : defaultDataMapping(id, study),
    missingPolicy: rec.design.family === 'paired' ? 'drop-incomplete-pairs' : 'drop-missing-values',
    conditions: rec.conditions.map((c) => ({ id: c.id, text: c.text, check: c.check, ...(c.basis !== undefined ? { basis: c.basis } : {}) })),
    scope: { causal: rec.scope.causal, generalize: rec.scope.generalize, text: rec.scope.text },
    warnings: [...rec.warnings],
    cautions: [...rec.cautions],
    answers: { ...a },
  };
  return plan;
}

function numberAnswer(a: Answers, id: string): number | undefined {
  const v = a[id];
  if (typeof v === 'number') return v;
  if (typeof v === 'string' && v.trim() !== '' && Number.isFinite(Number(v))) return Number(v);
  return undefined;
}
