/**
 * The procedure registry: one entry per ProcedureId, each a pure function in its own file.
 * `runProcedure` fills defaults, checks the options once, and dispatches.
 */
import { StatsError } from '../errors.js';
import { DEFAULT_OPTIONS, PROCEDURE_IDS, type ProcedureId, type ProcedureInput, type ProcedureOptions, type TestResult } from './types.js';
import { pairedT } from './paired-t.js';
import { welchT } from './welch-t.js';
import { pooledT } from './pooled-t.js';
import { signedRank } from './signed-rank.js';
import { rankSum } from './rank-sum.js';
import { mcnemar } from './mcnemar.js';
import { twoProportions } from './two-proportions.js';
import { crossoverT } from './crossover-t.js';
import { crossoverRankSum } from './crossover-rank-sum.js';
import { pairedEquivalence, welchEquivalence } from './equivalence.js';

type Paired = (first: number[], second: number[], o: ProcedureOptions) => TestResult;

const PAIRED: Partial<Record<ProcedureId, Paired>> = {
  'paired-t': pairedT,
  'signed-rank': signedRank,
  mcnemar,
  'paired-equivalence': pairedEquivalence,
};
const INDEPENDENT: Partial<Record<ProcedureId, Paired>> = {
  'welch-t': welchT,
  'pooled-t': pooledT,
  'rank-sum': rankSum,
  'two-proportions': twoProportions,
  'welch-equivalence': welchEquivalence,
};

export function procedureDesign(id: ProcedureId): ProcedureInput['kind'] {
  if (id === 'crossover-t') return 'crossover';
  return id in PAIRED ? 'paired' : 'independent';
}

export function checkOptions(partial: Partial<ProcedureOptions>): ProcedureOptions {
  const o: ProcedureOptions = { ...DEFAULT_OPTIONS, ...stripUndefined(partial) };
  if (!['two-sided', 'greater', 'less'].includes(o.alternative)) {
    throw new StatsError('invalid-option', `alternative must be two-sided, greater or less; got '${String(o.alternative)}'`);
  }
  if (!(o.confidence > 0 && o.confidence < 1)) {
    throw new StatsError('invalid-option', `confidence must be in (0, 1), e.g. 0.95; got ${o.confidence}`);
  }
  if (!Number.isFinite(o.nullValue)) {
    throw new StatsError('invalid-option', `null value must be a finite number; got ${o.nullValue}`);
  }
  if (o.margin !== undefined && !(o.margin > 0 && Number.isFinite(o.margin))) {
    throw new StatsError('invalid-option', `equivalence margin must be a positive number; got ${o.margin}`);
  }
  if (o.method !== undefined && !['auto', 'exact', 'normal'].includes(o.method)) {
    throw new StatsError('invalid-option', `method must be auto, exact or normal; got '${String(o.method)}'`);
  }
  if (o.correction !== undefined && typeof o.correction !== 'boolean') {
    throw new StatsError('invalid-option', `correction must be true or false; got '${String(o.correction)}'`);
  }
  return o;
}

function stripUndefined<T extends object>(o: T): Partial<T> {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as Partial<T>;
}

export function isProcedureId(x: string): x is ProcedureId {
  return (PROCEDURE_IDS as readonly string[]).includes(x);
}

export function runProcedure(id: ProcedureId, input: ProcedureInput, options: Partial<ProcedureOptions> = {}): TestResult {
  const o = checkOptions(options);
  if (id === 'crossover-t') {
    if (input.kind !== 'crossover') throw new StatsError('invalid-option', `crossover-t needs data by sequence group and period; got ${input.kind} data`);
    return crossoverT(input, o);
  }
  if (input.kind === 'crossover') {
    // The crossover's declared sensitivity analysis: rank-sum on the half period differences.
    if (id === 'rank-sum') return crossoverRankSum(input, o);
    throw new StatsError('invalid-option', `${id} does not take crossover data (crossover-t and rank-sum do)`);
  }
  const fn = (input.kind === 'paired' ? PAIRED : INDEPENDENT)[id];
  if (!fn) {
    throw new StatsError('invalid-option', `${id} is a ${procedureDesign(id)} procedure and cannot run on ${input.kind} data`);
  }
  return fn(input.first, input.second, o);
}
