/**
 * Hand-built recommendations for the plan, report and CLI tests, in invented scenarios (not
 * produced by the engine, so these tests do not depend on the rule base's wording).
 */
import type { Recommendation } from '../../src/engine/types.js';

const base = (): Omit<Recommendation, 'design' | 'procedure' | 'answers'> => ({
  conditions: [
    { id: 'independent-units', text: 'The differences of different units do not influence each other', check: 'Each unit was prepared and measured on its own; no shared batch or operator effect links them.' },
    { id: 'shape-small-n', text: 'With fewer than about 30 pairs the differences are roughly symmetric without outliers', check: 'Look at a dot plot of the differences before reading the result.', basis: 'common practice, no source' },
  ],
  difference: 'each difference is Oven A minus Oven B; a positive difference means Oven A was higher',
  hypotheses: {
    nullSymbols: 'mu_d = 0',
    alternativeSymbols: 'mu_d != 0',
    nullWords: 'on average Oven A and Oven B give the same crust moisture',
    alternativeWords: 'on average the two ovens give different crust moisture',
  },
  scope: { causal: true, generalize: false, text: 'The oven may be said to cause the difference for these loaves; the loaves were not sampled at random from a wider production.' },
  warnings: [],
  cautions: [],
  trace: [{ rule: 'split-units', fact: 'pairing', operator: 'equals', expected: 'split', actual: 'split', result: true }],
});

/** A bakery splits each dough piece in two and bakes one half in each oven. */
export function splitLoaves(): Recommendation {
  return {
    ...base(),
    design: { family: 'paired', kind: 'split-units', label: 'split units (each dough piece halved)', reasons: ['Each dough piece was divided in two and each half baked in a different oven.', 'The halves are linked by the piece number.'] },
    procedure: { id: 'paired-t', name: 'paired t on the differences', fallback: 'signed-rank', fallbackWhy: 'Does not lean on the differences being roughly normal.', nCounting: 'n = number of complete pairs (dough pieces)', df: 'df = pairs - 1', estimate: 'mean difference, Oven A minus Oven B', alternative: 'two-sided' },
    answers: { unit: 'dough piece', outcome: 'crust moisture', outcome_unit: '%', first_label: 'Oven A', second_label: 'Oven B', outcome_type: 'continuous', direction: 'any', pairing: 'split' },
  };
}

/** Hives randomly assigned to two spring feeds (independent groups). */
export function hiveFeeds(): Recommendation {
  return {
    ...base(),
    design: { family: 'independent', kind: 'randomized-groups', label: 'randomized groups', reasons: ['Each hive received one feed, chosen at random.'] },
    procedure: { id: 'welch-t', name: 'Welch two-sample t', fallback: 'rank-sum', fallbackWhy: 'Compares the groups without assuming roughly normal yields.', nCounting: 'n = hives in each group', df: 'df by the Welch-Satterthwaite formula', estimate: 'difference of mean yields, pollen patty minus sugar syrup', alternative: 'greater' },
    difference: 'each comparison is Pollen patty minus Sugar syrup; a positive difference means Pollen patty was higher',
    hypotheses: { nullSymbols: 'mu1 - mu2 = 0', alternativeSymbols: 'mu1 - mu2 > 0', nullWords: 'the feeds give the same mean honey yield', alternativeWords: 'pollen patty gives a higher mean honey yield' },
    answers: { unit: 'hive', outcome: 'honey yield', outcome_unit: 'kg', first_label: 'Pollen patty', second_label: 'Sugar syrup', outcome_type: 'continuous', direction: 'first_higher' },
  };
}

/** Call-centre agents work one week with each script, in random order, period recorded. */
export function scriptCrossover(): Recommendation {
  return {
    ...base(),
    design: { family: 'paired', kind: 'crossover', label: 'two-period crossover', reasons: ['Each agent used both scripts, in a randomly chosen order.', 'The week of each measurement was recorded.'] },
    procedure: { id: 'crossover-t', name: '2x2 crossover analysis', fallback: 'rank-sum', fallbackWhy: 'Rank-sum on the period differences.', nCounting: 'n = agents in each sequence', df: 'df = agents - 2', estimate: 'script effect, North minus South', alternative: 'two-sided' },
    answers: { unit: 'agent', outcome: 'calls resolved per hour', first_label: 'Script North', second_label: 'Script South', outcome_type: 'continuous', direction: 'any' },
  };
}

/** Each weld is inspected by a drone camera and by a rope-access inspector: crack found or not. */
export function weldInspection(): Recommendation {
  return {
    ...base(),
    design: { family: 'paired', kind: 'two-instruments', label: 'two methods on the same item', reasons: ['Both methods inspected every weld.'] },
    procedure: { id: 'mcnemar', name: 'McNemar test', fallback: null, nCounting: 'n = welds; the test uses the discordant welds', df: 'no df (exact binomial)', estimate: 'difference of detection proportions', alternative: 'two-sided' },
    answers: { unit: 'weld', outcome: 'crack found', first_label: 'Drone camera', second_label: 'Rope access', outcome_type: 'binary', direction: 'any' },
    warnings: ['The inspectors may have seen each other\'s findings; keep them blind to each other.'],
  };
}

/** A pharmacy depot checks that two cold boxes hold the same temperature (equivalence). */
export function coldBoxes(): Recommendation {
  return {
    ...base(),
    design: { family: 'paired', kind: 'repeated-measures', label: 'both boxes on the same delivery runs', reasons: ['Both boxes travelled on every run.'] },
    procedure: { id: 'paired-equivalence', name: 'paired equivalence (two one-sided tests)', fallback: null, nCounting: 'n = runs', df: 'df = runs - 1', estimate: 'mean difference, Box Alpine minus Box Coastal', alternative: 'two-sided', margin: 0.5 },
    answers: { unit: 'delivery run', outcome: 'mean box temperature', outcome_unit: '°C', first_label: 'Box Alpine', second_label: 'Box Coastal', outcome_type: 'continuous', direction: 'equivalence', margin: 0.5 },
    cautions: ['Medicines are involved: tandem does not replace a qualified statistician, the depot\'s validation protocol or local regulation.'],
  };
}

/** A vineyard measures sugar at four dates on the same vines: outside a two-condition comparison. */
export function vineDates(): Recommendation {
  return {
    ...base(),
    design: { family: 'other', kind: 'more-than-two', label: 'more than two time points', reasons: ['Each vine was measured at four dates.'], instead: 'Analyse all four dates together with a repeated-measures model or a trend over time; separate two-date tests inflate false alarms.' },
    procedure: { id: null, name: 'none', fallback: null, nCounting: '', df: '', estimate: '', alternative: 'two-sided' },
    conditions: [],
    difference: '',
    hypotheses: { nullSymbols: '', alternativeSymbols: '', nullWords: '', alternativeWords: '' },
    scope: { causal: false, generalize: false, text: '' },
    warnings: ['Pairwise tests between four dates multiply the chance of a false alarm.'],
    answers: { unit: 'vine', outcome: 'grape sugar', outcome_unit: '°Brix', first_label: 'June', second_label: 'July', outcome_type: 'continuous', measurements: 'more-than-two' },
  };
}

export const ALL_PLANNABLE = { splitLoaves, hiveFeeds, scriptCrossover, weldInspection, coldBoxes };
