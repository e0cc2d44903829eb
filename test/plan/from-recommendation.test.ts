import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/errors.js';
import { checkPlanObject, defaultDataMapping, planFromRecommendation, slugify } from '../../src/plan/index.js';
import { coldBoxes, hiveFeeds, scriptCrossover, splitLoaves, vineDates, weldInspection } from './recommendations.js';

describe('planFromRecommendation', () => {
  it('takes the study labels from the fixed answers and the design, procedure and statements from the recommendation', () => {
    const plan = planFromRecommendation(splitLoaves());
    expect(plan.format).toBe('tandem-plan/1');
    expect(plan.study).toEqual({ unit: 'dough piece', outcome: 'crust moisture', outcomeUnit: '%', first: 'Oven A', second: 'Oven B' });
    expect(plan.design).toEqual({ family: 'paired', kind: 'split-units', reasons: splitLoaves().design.reasons });
    expect(plan.procedure).toEqual({ id: 'paired-t', alternative: 'two-sided', confidence: 0.95, nullValue: 0 });
    expect(plan.sensitivity).toEqual({ id: 'signed-rank', why: 'Does not lean on the differences being roughly normal.' });
    expect(plan.missingPolicy).toBe('drop-incomplete-pairs');
    expect(plan.answers).toEqual(splitLoaves().answers);
    expect(plan.title).toBe('Oven A versus Oven B: crust moisture');
    expect(plan.created).toBeUndefined(); // pure: no clock unless given
    expect(checkPlanObject(plan)).toEqual([]);
  });

  it('defaults to a wide layout with columns named after the labels for paired designs', () => {
    expect(planFromRecommendation(splitLoaves()).data).toEqual({ layout: 'wide', id: 'id', first: 'oven_a', second: 'oven_b', pairBy: 'id' });
  });

  it('defaults to a groups layout for independent designs, the levels being the labels', () => {
    const plan = planFromRecommendation(hiveFeeds());
    expect(plan.data).toEqual({ layout: 'groups', group: 'group', value: 'honey_yield', firstLevel: 'Pollen patty', secondLevel: 'Sugar syrup' });
    expect(plan.missingPolicy).toBe('drop-missing-values');
    expect(plan.procedure.alternative).toBe('greater');
  });

  it('defaults to a crossover layout for the crossover analysis', () => {
    expect(planFromRecommendation(scriptCrossover()).data).toEqual({
      layout: 'crossover',
      id: 'id',
      sequence: 'sequence',
      firstThenSecond: 'script_north-first',
      secondThenFirst: 'script_south-first',
      period1: 'period_1',
      period2: 'period_2',
    });
  });

  it('names the event value of a binary outcome when the answers give it, and has no sensitivity when none is declared', () => {
    const plan = planFromRecommendation(weldInspection());
    expect(plan.study.event).toBeUndefined(); // the data layer recognises 0/1, yes/no, true/false
    expect(plan.sensitivity).toBeNull();
    expect(checkPlanObject(plan)).toEqual([]);
    const rec = weldInspection();
    rec.answers.event = 'crack';
    expect(planFromRecommendation(rec).study.event).toBe('crack');
    const continuous = splitLoaves();
    continuous.answers.event = 'crack'; // not a binary procedure: no event in the plan
    expect(planFromRecommendation(continuous).study.event).toBeUndefined();
  });

  it('carries the equivalence margin and the cautions', () => {
    const plan = planFromRecommendation(coldBoxes());
    expect(plan.procedure.margin).toBe(0.5);
    expect(plan.cautions[0]).toMatch(/qualified statistician/);
    expect(checkPlanObject(plan)).toEqual([]);
  });

  it('takes the confidence level from the recommendation when it gives one (equivalence: 1 - 2 alpha)', () => {
    const rec = coldBoxes();
    rec.procedure.confidence = 0.9;
    const plan = planFromRecommendation(rec);
    expect(plan.procedure.confidence).toBe(0.9);
    expect(checkPlanObject(plan)).toEqual([]);
  });

  it('keeps the margin of an equivalence aim for a yes/no outcome, and checks it is a proportion', () => {
    const rec = weldInspection();
    rec.procedure.margin = 0.05;
    expect(planFromRecommendation(rec).procedure.margin).toBe(0.05);
    expect(checkPlanObject(planFromRecommendation(rec))).toEqual([]);
    rec.procedure.margin = 5;
    expect(checkPlanObject(planFromRecommendation(rec))).toEqual([expect.stringMatching(/procedure.margin: procedure.margin 5 cannot bound a difference of two proportions/)]);
  });

  it('takes the margin from the answers when the recommendation leaves it out', () => {
    const rec = coldBoxes();
    delete rec.procedure.margin;
    rec.answers.margin = '0.25';
    expect(planFromRecommendation(rec).procedure.margin).toBe(0.25);
  });

  it('uses a given title, data mapping and creation time', () => {
    const data = { layout: 'long' as const, id: 'piece', condition: 'oven', value: 'moisture', firstLevel: 'A', secondLevel: 'B' };
    const plan = planFromRecommendation(splitLoaves(), { title: 'Deck oven trial, spring', data, created: '2025-04-02T08:30:00.000Z' });
    expect(plan.title).toBe('Deck oven trial, spring');
    expect(plan.data).toEqual(data);
    expect(plan.data).not.toBe(data);
    expect(plan.created).toBe('2025-04-02T08:30:00.000Z');
  });

  it('refuses a design outside a two-condition comparison, saying what to do instead', () => {
    expect(() => planFromRecommendation(vineDates())).toThrow(InputError);
    expect(() => planFromRecommendation(vineDates())).toThrow(/more than two time points.*repeated-measures model/);
  });

  it('fills neutral labels when the answers do not name them', () => {
    const rec = splitLoaves();
    rec.answers = { outcome_type: 'continuous' };
    const plan = planFromRecommendation(rec);
    expect(plan.study).toEqual({ unit: 'unit', outcome: 'outcome', first: 'first condition', second: 'second condition' });
    expect(plan.data).toMatchObject({ first: 'first_condition', second: 'second_condition' });
  });
});

describe('default column names', () => {
  it('slugify makes plain lower-case names and falls back when nothing is left', () => {
    expect(slugify('Kiln #3 (east)', 'x')).toBe('kiln_3_east');
    expect(slugify('Crème brûlée', 'x')).toBe('creme_brulee');
    expect(slugify('%%%', 'first')).toBe('first');
  });

  it('keeps the two value columns and the id column apart', () => {
    const study = { unit: 'u', outcome: 'o', first: 'Line 1', second: 'line-1' };
    expect(defaultDataMapping('paired-t', study)).toMatchObject({ first: 'line_1_1', second: 'line_1_2' });
    expect(defaultDataMapping('signed-rank', { ...study, first: 'ID', second: 'Tag' })).toMatchObject({ id: 'unit_id', first: 'id', second: 'tag' });
    expect(defaultDataMapping('welch-t', { ...study, outcome: 'Group' })).toMatchObject({ group: 'condition', value: 'group' });
  });
});
