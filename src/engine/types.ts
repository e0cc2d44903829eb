/**
 * The engine's contract: what the rule base asks, and what a classification returns. The engine
 * is pure (no I/O, no colours); src/interview asks the questions, src/report formats the result.
 */
import type { Alternative, ProcedureId } from '../stats/types.js';

export type AnswerValue = string | number | boolean;
/** Answers by question id. */
export type Answers = Record<string, AnswerValue>;

export interface Choice {
  value: string;
  label: string;
  /** Plain words with a short invented example of this answer. */
  help: string;
}

export interface Question {
  id: string;
  /** The question as asked. */
  text: string;
  /** Explains the trade term in plain words. */
  help: string;
  type: 'choice' | 'number' | 'text';
  choices?: Choice[];
  /** number questions */
  min?: number;
  max?: number;
  /** When true, the value must be strictly greater than `min` (e.g. an equivalence margin > 0). */
  minExclusive?: boolean;
  integer?: boolean;
  /** May be left blank (text/number). */
  optional?: boolean;
}

/** One evaluated condition, recorded so the tool can say why. */
export interface TraceStep {
  /** The rule (or question guard) that was being evaluated. */
  rule: string;
  fact: string;
  operator: string;
  expected: unknown;
  actual: unknown;
  result: boolean;
}

export type DesignFamily = 'paired' | 'independent' | 'other';

export interface ConditionToCheck {
  id: string;
  /** The condition in the trade's words. */
  text: string;
  /** How to check it. */
  check: string;
  /** "common practice" when it is a rule of thumb with no published source. */
  basis?: string;
}

export interface Recommendation {
  design: {
    family: DesignFamily;
    /** e.g. repeated-measures, crossover, natural-pairs, matched-before, matched-after, split-units,
     * blocks, independent-samples, randomized-groups, existing-groups, more-than-two, clustered,
     * no-link, arbitrary-pairing */
    kind: string;
    label: string;
    /** Why: sentences built from the answers that decided it. */
    reasons: string[];
    /** For family 'other': what to do instead. */
    instead?: string;
    /** The id of the classification rule (rules/*.yaml) that decided the design. */
    rule?: string;
  };
  procedure: {
    id: ProcedureId | null;
    name: string;
    /** Pre-declared sensitivity analysis (fixed now, not switched after seeing the data). */
    fallback: ProcedureId | null;
    fallbackWhy?: string;
    /** How n is counted, e.g. "n = number of complete pairs". */
    nCounting: string;
    /** e.g. "df = pairs - 1". */
    df: string;
    estimate: string;
    alternative: Alternative;
    margin?: number;
    /** Confidence level the plan should use when it is not 0.95 (equivalence: 0.90, i.e. 1 - 2 alpha). */
    confidence?: number;
    /** When the procedure applies (from the catalogue). */
    applies?: string;
    /** Notes on how to read the result, e.g. how equivalence is decided. */
    notes?: string[];
    /** Published sources for the procedure (author, year). */
    references?: string[];
  };
  conditions: ConditionToCheck[];
  /** "each difference is <first> minus <second>; a positive difference means <first> was higher" */
  difference: string;
  hypotheses: { nullSymbols: string; alternativeSymbols: string; nullWords: string; alternativeWords: string };
  /** What the conclusion may claim. */
  scope: { causal: boolean; generalize: boolean; text: string };
  warnings: string[];
  cautions: string[];
  trace: TraceStep[];
  /** The answers that produced it. */
  answers: Answers;
}

/**
 * The loaded rule base as other modules see it. The engine's implementation may hold more
 * (designs, procedures, rules), but `questions` lists every question in asking order.
 */
export interface RuleBaseView {
  questions: Question[];
}
