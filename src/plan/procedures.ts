/**
 * What the plan layer needs to know about each procedure id to check a plan by hand-edit or by
 * machine: the design family it belongs to, whether it reads a binary outcome, whether it is an
 * equivalence procedure (and so needs a margin), the data layouts it can read, and a readable name.
 *
 * This is a static table, not the rule base: a plan must be checkable without loading rules/.
 */
import type { DesignFamily } from '../engine/types.js';
import { PROCEDURE_IDS, type ProcedureId } from '../stats/types.js';
import type { DataMapping } from './types.js';

export type Layout = DataMapping['layout'];

export interface ProcedureFacts {
  family: Exclude<DesignFamily, 'other'>;
  binary: boolean;
  equivalence: boolean;
  layouts: readonly Layout[];
  name: string;
}

const PAIRED_LAYOUTS: readonly Layout[] = ['wide', 'long'];
const GROUP_LAYOUTS: readonly Layout[] = ['groups', 'columns'];

export const PROCEDURES: Record<ProcedureId, ProcedureFacts> = {
  'paired-t': { family: 'paired', binary: false, equivalence: false, layouts: PAIRED_LAYOUTS, name: 'paired t on the differences' },
  'signed-rank': { family: 'paired', binary: false, equivalence: false, layouts: PAIRED_LAYOUTS, name: 'Wilcoxon signed-rank on the differences' },
  mcnemar: { family: 'paired', binary: true, equivalence: false, layouts: PAIRED_LAYOUTS, name: 'McNemar test on the discordant pairs' },
  'paired-equivalence': { family: 'paired', binary: false, equivalence: true, layouts: PAIRED_LAYOUTS, name: 'paired equivalence by two one-sided tests' },
  // A 2x2 crossover is a paired design (each unit has both conditions) analysed as two groups of
  // period differences (Hills and Armitage 1979).
  'crossover-t': { family: 'paired', binary: false, equivalence: false, layouts: ['crossover'], name: '2x2 crossover analysis (t on period differences between sequences)' },
  'welch-t': { family: 'independent', binary: false, equivalence: false, layouts: GROUP_LAYOUTS, name: 'Welch two-sample t' },
  'pooled-t': { family: 'independent', binary: false, equivalence: false, layouts: GROUP_LAYOUTS, name: 'pooled two-sample t (equal spreads assumed)' },
  'rank-sum': { family: 'independent', binary: false, equivalence: false, layouts: GROUP_LAYOUTS, name: 'Wilcoxon-Mann-Whitney rank-sum' },
  'two-proportions': { family: 'independent', binary: true, equivalence: false, layouts: GROUP_LAYOUTS, name: 'difference of two proportions (Fisher exact for small counts)' },
  'welch-equivalence': { family: 'independent', binary: false, equivalence: true, layouts: GROUP_LAYOUTS, name: 'two-group equivalence by two one-sided tests (Welch)' },
};

export function isProcedureId(x: unknown): x is ProcedureId {
  return typeof x === 'string' && (PROCEDURE_IDS as readonly string[]).includes(x);
}

export function procedureName(id: ProcedureId): string {
  return PROCEDURES[id].name;
}

/** Procedure ids that belong to a design family, for messages ("allowed: ..."). */
export function proceduresOf(family: 'paired' | 'independent'): ProcedureId[] {
  return PROCEDURE_IDS.filter((id) => PROCEDURES[id].family === family);
}

/**
 * Sensitivity analyses that may be declared beside a main procedure: the same design family and
 * the same kind of outcome (binary or numeric), not an equivalence test beside a difference test,
 * and not the main procedure itself. A crossover
 * may also declare the rank-sum test on the period differences (the rank-based crossover
 * analysis of Koch 1972), which reads the same crossover layout.
 */
export function sensitivityAllowed(main: ProcedureId): ProcedureId[] {
  const m = PROCEDURES[main];
  if (main === 'crossover-t') return ['rank-sum'];
  return PROCEDURE_IDS.filter((id) => {
    const s = PROCEDURES[id];
    // An equivalence test answers a different question than a difference test: it is not a
    // sensitivity analysis of one.
    if (s.equivalence && !m.equivalence) return false;
    return id !== main && id !== 'crossover-t' && s.family === m.family && s.binary === m.binary;
  });
}
