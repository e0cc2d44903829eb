/** Placeholder: replaced by the implementation with its references. */
import { StatsError } from '../errors.js';
import type { ProcedureInput, ProcedureOptions, TestResult } from './types.js';

export function crossoverT(_input: Extract<ProcedureInput, { kind: 'crossover' }>, _o: ProcedureOptions): TestResult {
  throw new StatsError('unsupported', 'crossover-t is not built yet');
}
