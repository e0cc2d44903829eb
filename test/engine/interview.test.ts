/**
 * nextQuestion asks only what matters given earlier answers; classify needs every asked answer,
 * ignores answers to questions no longer on the path, and records the trace of its decision.
 * Stories are invented (a cooperage, a hop farm, a ferry operator).
 */
import { describe, expect, test } from 'vitest';
import { InputError } from '../../src/errors.js';
import { answerProblem, classify, loadRuleBase, nextQuestion, questionsOnPath } from '../../src/engine/index.js';
import type { Answers } from '../../src/engine/types.js';
import { writeRules } from '../rules/tiny-rules.js';

const tiny = loadRuleBase(writeRules());
const rb = loadRuleBase();

/** Answers questions in order with `pick`, returning the ids asked. */
function interview(pick: Record<string, string | number>): { asked: string[]; answers: Answers } {
  const answers: Answers = {};
  const asked: string[] = [];
  for (let q = nextQuestion(rb, answers); q; q = nextQuestion(rb, answers)) {
    asked.push(q.id);
    if (!(q.id in pick)) throw new Error(`unexpected question ${q.id}`);
    answers[q.id] = pick[q.id];
    if (asked.length > 60) throw new Error('loop');
  }
  return { asked, answers };
}

const hops = {
  unit: 'hop bine', outcome: 'alpha acid', outcome_type: 'continuous', outcome_unit: '%', first_label: 'drip line', second_label: 'sprinkler',
  conditions_count: 'two', clustered: 'no', measurements_per_unit: 'one', pairing: 'none', group_formation: 'random-assignment', units_sampled: 'no',
  expected_shape: 'symmetric', n_first: 20, n_second: 20, direction: 'any-difference', pooled_requested: 'no', people_or_safety: 'none',
};

describe('nextQuestion (texts that name earlier answers)', () => {
  test('the direction choices name the two conditions once they are known, and read generically before', () => {
    const upTo = { ...hops } as Answers;
    delete upTo.direction;
    delete upTo.pooled_requested;
    delete upTo.people_or_safety;
    const q = nextQuestion(rb, upTo);
    expect(q?.id).toBe('direction');
    const labels = Object.fromEntries((q?.choices ?? []).map((c) => [c.value, c.label]));
    expect(labels['first-higher']).toBe('drip line gives higher values');
    expect(labels['second-higher']).toBe('sprinkler gives higher values');
    expect(labels.equivalence).toBe('drip line and sprinkler are equivalent within a margin');
    const blank = nextQuestion(rb, { ...upTo, first_label: '', second_label: '' });
    expect(blank?.choices?.find((c) => c.value === 'first-higher')?.label).toBe('the first condition gives higher values');
  });
});

describe('nextQuestion (guards)', () => {
  test('the tiny rule base asks the number question only for the same-barrel layout', () => {
    expect(nextQuestion(tiny, {})?.id).toBe('unit');
    const base = { unit: 'barrel', first_label: 'heavy toast', second_label: 'light toast' };
    expect(nextQuestion(tiny, { ...base, layout: 'same' })?.id).toBe('size');
    expect(nextQuestion(tiny, { ...base, layout: 'different' })?.id).toBe('direction');
    expect(nextQuestion(tiny, { ...base, layout: 'different', direction: 'first-higher' })).toBeNull();
  });

  test('an independent study is not asked about pairing details, sides, order or pairs', () => {
    const { asked } = interview(hops);
    expect(asked).toEqual(Object.keys(hops));
    for (const id of ['within_unit_kind', 'order_assignment', 'period_recorded', 'side_assignment', 'pair_assignment', 'one_to_one', 'link_id', 'n_pairs', 'margin', 'randomized_unit']) {
      expect(asked).not.toContain(id);
    }
  });

  test('a study with more than two conditions is not asked about the comparison at all', () => {
    const { asked } = interview({ unit: 'hop bine', outcome: 'yield', outcome_type: 'continuous', outcome_unit: 'kg', first_label: 'a', second_label: 'b', conditions_count: 'more-than-two', people_or_safety: 'none' });
    expect(asked).toEqual(['unit', 'outcome', 'outcome_type', 'outcome_unit', 'first_label', 'second_label', 'conditions_count', 'people_or_safety']);
  });

  test('the pooled-t question is skipped when the rank procedure leads (skewed, small)', () => {
    const { asked } = interview({ ...hops, expected_shape: 'skewed', n_first: 12, n_second: 15 });
    expect(asked).not.toContain('pooled_requested');
  });

  test('a period question follows only a randomized order of two treatments', () => {
    const paired = { ...hops, measurements_per_unit: 'two', within_unit_kind: 'two-treatments', order_assignment: 'fixed', link_id: 'yes', n_pairs: 20 };
    const fixed = questionsOnPath(rb, paired).map((q) => q.id);
    expect(fixed).not.toContain('period_recorded');
    const random = questionsOnPath(rb, { ...paired, order_assignment: 'randomized' }).map((q) => q.id);
    expect(random).toContain('period_recorded');
  });

  test('an answered optional question left blank is not asked again', () => {
    const a = { unit: 'hop bine', outcome: 'yield', outcome_type: 'continuous' };
    expect(nextQuestion(rb, a)?.id).toBe('outcome_unit');
    expect(nextQuestion(rb, { ...a, outcome_unit: '' })?.id).toBe('first_label');
  });

  test('the fixed question ids exist with their types and choice values', () => {
    const byId = new Map(rb.questions.map((q) => [q.id, q]));
    for (const id of ['unit', 'outcome', 'outcome_unit', 'first_label', 'second_label']) expect(byId.get(id)?.type).toBe('text');
    expect(byId.get('outcome_unit')?.optional).toBe(true);
    expect(byId.get('outcome_type')?.choices?.map((c) => c.value)).toEqual(['continuous', 'count', 'ordinal', 'binary']);
    expect(byId.get('direction')?.choices?.map((c) => c.value)).toEqual(['first-higher', 'second-higher', 'any-difference', 'equivalence']);
    expect(byId.get('margin')).toMatchObject({ type: 'number', min: 0, minExclusive: true });
    for (const q of rb.questions) {
      expect(q.help.length, `${q.id} help`).toBeGreaterThan(20);
      if (q.type !== 'choice') expect(q.help, `${q.id} help has an example`).toMatch(/e\.g\.|for example/);
      for (const c of q.choices ?? []) expect(c.help, `${q.id}.${c.value} help has an example`).toMatch(/e\.g\./);
    }
  });
});

describe('classify', () => {
  test('missing answers give InputError listing the missing question ids', () => {
    const { people_or_safety: _p, direction: _d, ...partial } = hops;
    try {
      classify(rb, partial);
      expect.unreachable();
    } catch (err) {
      expect(err).toBeInstanceOf(InputError);
      expect((err as InputError).message).toBe('missing answers: direction, people_or_safety');
      expect((err as InputError).problems.map((p) => p.code)).toEqual(['missing-key', 'missing-key']);
    }
  });

  test('an answer that does not fit its question is refused with the allowed values', () => {
    expect(() => classify(rb, { ...hops, pairing: 'siblings' })).toThrow(InputError);
    try {
      classify(rb, { ...hops, n_first: 2.5 });
    } catch (err) {
      expect((err as InputError).problems[0].message).toContain("'n_first' must be a whole number");
    }
    const margin = rb.questions.find((q) => q.id === 'margin')!;
    expect(answerProblem(margin, 0)).toBe("'margin' must be greater than 0; got 0");
    expect(answerProblem(margin, 0.5)).toBeNull();
  });

  test('answers to questions that no longer apply are ignored (and not echoed)', () => {
    const rec = classify(rb, { ...hops, within_unit_kind: 'before-after', n_pairs: 9 });
    expect(rec.design.kind).toBe('randomized-groups');
    expect(rec.answers).not.toHaveProperty('within_unit_kind');
    expect(rec.answers).not.toHaveProperty('n_pairs');
  });

  test('a recommendation states direction, hypotheses, scope and the trace that led to it', () => {
    const rec = classify(rb, { ...hops, direction: 'first-higher' });
    expect(rec.design).toMatchObject({ family: 'independent', kind: 'randomized-groups', rule: 'randomized-groups' });
    expect(rec.procedure).toMatchObject({ id: 'welch-t', fallback: 'rank-sum', alternative: 'greater' });
    expect(rec.difference).toContain('drip line minus sprinkler');
    expect(rec.difference).toContain('a positive difference means drip line was higher');
    expect(rec.hypotheses.alternativeSymbols).toBe('Ha: μ1 − μ2 > 0');
    expect(rec.hypotheses.alternativeWords).toMatch(/^The mean under drip line minus the mean under sprinkler is greater than zero/);
    expect(rec.scope).toMatchObject({ causal: true, generalize: false });
    const step = rec.trace.find((s) => s.rule === 'randomized-groups' && s.fact === 'group_formation');
    expect(step).toEqual({ rule: 'randomized-groups', fact: 'group_formation', operator: 'equals', expected: 'random-assignment', actual: 'random-assignment', result: true });
    expect(rec.trace.some((s) => s.rule === 'select-welch-t')).toBe(true);
    expect(rec.conditions.map((c) => c.id)).toEqual(['units-independent', 'sampling-assignment', 'groups-shape', 'size-rule-groups']);
    expect(rec.conditions.find((c) => c.id === 'size-rule-groups')?.basis).toMatch(/common practice/);
  });

  test('the second-higher and equivalence directions give matching alternatives, margin and 90% level', () => {
    expect(classify(rb, { ...hops, direction: 'second-higher' }).procedure.alternative).toBe('less');
    const { pooled_requested: _x, ...eq } = hops;
    const rec = classify(rb, { ...eq, direction: 'equivalence', margin: 0.4 });
    expect(rec.procedure).toMatchObject({ id: 'welch-equivalence', alternative: 'two-sided', margin: 0.4, confidence: 0.9 });
    expect(rec.hypotheses.alternativeSymbols).toBe('Ha: −0.4 < μ1 − μ2 < 0.4');
    expect(rec.hypotheses.nullSymbols).toBe('H0: μ1 − μ2 ≤ −0.4 or μ1 − μ2 ≥ 0.4');
  });

  test('a paired design counts pairs and has df = pairs - 1', () => {
    const paired = { ...hops, measurements_per_unit: 'one', pairing: 'split-units', pair_assignment: 'randomized', one_to_one: 'yes', link_id: 'yes', n_pairs: 16 };
    const { group_formation: _g, n_first: _a, n_second: _b, pooled_requested: _p, ...rest } = paired;
    const rec = classify(rb, rest);
    expect(rec.design).toMatchObject({ family: 'paired', kind: 'split-units' });
    expect(rec.procedure.nCounting).toMatch(/^n = number of complete pairs/);
    expect(rec.procedure.df).toBe('df = pairs - 1');
  });

  test('a design outside the comparison says what to do instead and has no procedure', () => {
    const rec = classify(rb, { unit: 'hop bine', outcome: 'yield', outcome_type: 'continuous', outcome_unit: '', first_label: 'a', second_label: 'b', conditions_count: 'two', clustered: 'yes', randomized_unit: 'cluster', people_or_safety: 'none' });
    expect(rec.design).toMatchObject({ family: 'other', kind: 'clustered' });
    expect(rec.design.instead).toMatch(/cluster/);
    expect(rec.procedure.id).toBeNull();
    expect(rec.warnings.join(' ')).toMatch(/pseudo-replication/);
  });

  test('classify is pure: the same answers give the same recommendation, and the answers object is untouched', () => {
    const a = { ...hops };
    const r1 = classify(rb, a);
    const r2 = classify(rb, a);
    expect(r1).toEqual(r2);
    expect(a).toEqual(hops);
  });
});
