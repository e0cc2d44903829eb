/**
 * The analysis plan file, format `tandem-plan/1` (YAML; schema in schemas/plan-v1.schema.json).
 * Written by `tandem advise --plan`, read by `tandem analyze PLAN`, `tandem size PLAN` and
 * `tandem audit`, checked by `tandem plan check`.
 */
import type { Answers, ConditionToCheck, DesignFamily } from '../engine/types.js';
import type { Alternative, ProcedureId } from '../stats/types.js';

export const PLAN_FORMAT = 'tandem-plan/1';

export type DataMapping =
  /** Paired, one row per unit: two value columns, optional id column. */
  | { layout: 'wide'; first: string; second: string; id?: string; pairBy: 'id' | 'row-order' }
  /** Paired, one row per measurement: id, condition and value columns. */
  | { layout: 'long'; id: string; condition: string; value: string; firstLevel: string; secondLevel: string }
  /**
   * Independent: a group column and a value column; an optional id column lets the data layer
   * catch a unit measured more than once (pseudo-replication).
   */
  | { layout: 'groups'; group: string; value: string; firstLevel: string; secondLevel: string; id?: string }
  /** Independent: two columns, possibly of different lengths (blank cells). */
  | { layout: 'columns'; first: string; second: string }
  /** 2x2 crossover: one row per subject. */
  | {
      layout: 'crossover';
      id?: string;
      sequence: string;
      /** The sequence value meaning "first condition in period 1" (and the other one). */
      firstThenSecond: string;
      secondThenFirst: string;
      period1: string;
      period2: string;
    };

export interface Plan {
  format: typeof PLAN_FORMAT;
  title: string;
  /** tandem version that wrote it, and when (ISO 8601). */
  createdBy?: string;
  created?: string;
  study: {
    /** The unit that is measured, e.g. "bridge deck panel". */
    unit: string;
    outcome: string;
    outcomeUnit?: string;
    /** Condition labels; differences are first minus second. */
    first: string;
    second: string;
    /** binary outcomes: the value that counts as the event, e.g. "1" or "yes". */
    event?: string;
  };
  design: { family: DesignFamily; kind: string; reasons: string[] };
  difference: string;
  procedure: {
    id: ProcedureId;
    alternative: Alternative;
    confidence: number;
    nullValue: number;
    margin?: number;
  };
  sensitivity: { id: ProcedureId; why: string } | null;
  hypotheses: { nullSymbols: string; alternativeSymbols: string; nullWords: string; alternativeWords: string };
  data: DataMapping & { missing?: string[]; delimiter?: ',' | ';' | '\t' | 'auto' };
  missingPolicy: 'drop-incomplete-pairs' | 'drop-missing-values';
  conditions: ConditionToCheck[];
  scope: { causal: boolean; generalize: boolean; text: string };
  warnings: string[];
  cautions: string[];
  answers: Answers;
  /** Optional planning inputs (tandem size). */
  planning?: {
    difference?: number;
    sd?: number;
    sdDiff?: number;
    /** Independent designs: the second group's SD when it differs from sd (Welch). */
    sd2?: number;
    rho?: number;
    effectSize?: number;
    alpha?: number;
    power?: number;
    ratio?: number;
    attrition?: number;
    n?: number;
    margin?: number;
  };
}
