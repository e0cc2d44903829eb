/**
 * The rank-based analysis of a 2x2 crossover (Koch 1972, "The use of non-parametric methods in the
 * statistical analysis of the two-period change-over design", Biometrics 28: 577-584): the
 * Wilcoxon-Mann-Whitney rank-sum test on the half period differences h = (period 1 - period 2)/2,
 * comparing the sequence that had the first condition in period 1 with the other sequence.
 *
 * Under the model of src/stats/crossover-t.ts, h has mean (pi + tau)/2 in one sequence and
 * (pi - tau)/2 in the other, so the shift between sequences is tau (first minus second), free of
 * the period effect; its Hodges-Lehmann estimate and interval estimate tau. It is the declared
 * sensitivity analysis for crossover-t.
 *
 * Example (invented): half differences 1, 1.5, 0.5 against -1.5, -1, -1.5: every first-sequence
 * value exceeds every second-sequence value, U = 9 of 9, Hodges-Lehmann shift 2.5.
 */
import type { ProcedureInput, ProcedureOptions, TestResult } from './types.js';
import { rankSum } from './rank-sum.js';
import { checkFinite } from './sample.js';
import { StatsError } from '../errors.js';

type CrossoverInput = Extract<ProcedureInput, { kind: 'crossover' }>;

/** (period 1 - period 2) / 2 per subject; halving first keeps 1e308-sized values finite. */
function halfDifferences(seq: { period1: number[]; period2: number[] }, label: string): number[] {
  checkFinite(seq.period1, `crossover rank-sum, ${label} period 1`);
  checkFinite(seq.period2, `crossover rank-sum, ${label} period 2`);
  if (seq.period1.length !== seq.period2.length) {
    throw new StatsError('invalid-option', `crossover rank-sum: sequence ${label} has ${seq.period1.length} period 1 values but ${seq.period2.length} period 2 values`);
  }
  return seq.period1.map((p1, i) => p1 / 2 - seq.period2[i] / 2);
}

export function crossoverRankSum(input: CrossoverInput, o: ProcedureOptions): TestResult {
  const fs = halfDifferences(input.firstThenSecond, 'firstThenSecond');
  const sf = halfDifferences(input.secondThenFirst, 'secondThenFirst');
  const r = rankSum(fs, sf, o);
  return {
    ...r,
    method: 'Wilcoxon-Mann-Whitney rank-sum on the half period differences between sequences (Koch 1972)',
    estimateName: `Hodges-Lehmann estimate of the treatment effect (first minus second)`,
    notes: [
      'Each subject contributes (period 1 - period 2)/2; the shift between the two sequence groups estimates the treatment effect, free of the period effect.',
      ...r.notes,
    ],
  };
}
