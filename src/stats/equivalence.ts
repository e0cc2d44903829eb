/** Placeholder: replaced by the implementation with its references. */
import { StatsError } from '../errors.js';
import type { ProcedureOptions, TestResult } from './types.js';

export function pairedEquivalence(_first: number[], _second: number[], _o: ProcedureOptions): TestResult {
  throw new StatsError('unsupported', 'paired-equivalence is not built yet');
}
export function welchEquivalence(_first: number[], _second: number[], _o: ProcedureOptions): TestResult {
  throw new StatsError('unsupported', 'welch-equivalence is not built yet');
}
