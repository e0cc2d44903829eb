/**
 * `planSize`: one call that answers the planning question and gathers what the report shows
 * (the answer, what pairing buys, and the power curve). Pure: numbers in, a plain object out.
 *
 * Example: planSize(resolveInputs({ design: 'paired', difference: 2.5, sd: 4, rho: 0.5 }))
 * answers 23 pairs (sdDiff = 4 * sqrt(2 * 0.5) = 4) and compares with 42 + 42 = 84 units in two
 * independent groups with SD 4.
 */
import { pairingComparison, powerCurve } from './compare.js';
import type { ResolvedInputs } from './inputs.js';
import { detectableDifference, powerAtSize, sampleSize } from './solve.js';
import type { ComparisonRow, CurvePoint, SizeAnswer, SizeSpec } from './types.js';

export interface SizePlan {
  spec: SizeSpec;
  answer: SizeAnswer;
  /** Pairs versus two groups across correlations; null when the single-measurement SD is unknown. */
  comparison: ComparisonRow[] | null;
  /** Power against n for the planned difference (empty for the detectable-difference question). */
  curve: CurvePoint[];
  notes: string[];
}

export function planSize(resolved: ResolvedInputs): SizePlan {
  const { spec, question } = resolved;
  const notes = [...resolved.notes];
  let answer: SizeAnswer;
  if (question === 'sample-size') answer = sampleSize(spec);
  else if (question === 'power') answer = powerAtSize(spec, resolved.n as number);
  else answer = detectableDifference(spec, resolved.n as number);
  const comparison = question === 'detectable-difference' ? null : pairingComparison(spec);
  if (comparison === null && question !== 'detectable-difference' && spec.design === 'paired') {
    notes.push('give --sd with --rho (instead of --sd-diff or d_z) to compare pairs with two independent groups');
  }
  const curve = question === 'detectable-difference' ? [] : powerCurve(spec, answer.layout.n);
  return { spec, answer, comparison, curve, notes };
}

export { resolveInputs } from './inputs.js';
export type { RawSizeInputs, ResolvedInputs } from './inputs.js';
