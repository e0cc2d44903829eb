/** Placeholder: replaced by the implementation with its references. */
import { StatsError } from '../errors.js';
import type { ProcedureOptions, TestResult } from './types.js';

export function signedRank(_first: number[], _second: number[], _o: ProcedureOptions): TestResult {
  throw new StatsError('unsupported', 'signed-rank is not built yet');
}
