/**
 * The loaded rule base as the engine holds it (pure data, built by src/rules/build.ts from the
 * YAML files in rules/). Every item keeps its source position so that the completeness check can
 * point at the text.
 *
 * Stages: questions and classification rules see only answers (and derived facts); procedure
 * selections also see the design (`design_family`, `design_kind`); conditions, statements,
 * warnings and cautions also see the procedure (`procedure`, `fallback`).
 */
import type { Question } from './types.js';
import type { RuleBaseView, DesignFamily } from './types.js';
import type { Alternative, ProcedureId } from '../stats/types.js';

export interface Pos {
  file: string;
  line: number;
  col: number;
}

/** The closed vocabulary of leaf operators. */
export const LEAF_OPERATORS = ['equals', 'in', 'answered', 'gt', 'gte', 'lt', 'lte'] as const;
export type LeafOperator = (typeof LEAF_OPERATORS)[number];
/** The closed vocabulary of combining operators. */
export const GROUP_OPERATORS = ['all', 'any', 'not', 'ref'] as const;

export type Condition =
  | { op: 'all'; items: Condition[]; pos: Pos }
  | { op: 'any'; items: Condition[]; pos: Pos }
  | { op: 'not'; item: Condition; pos: Pos }
  | { op: 'ref'; name: string; pos: Pos }
  | { op: LeafOperator; fact: string; value: unknown; pos: Pos };

/** Facts produced by the engine itself after classification (stage 1) and selection (stage 2). */
export const STAGE_FACTS: Record<string, 1 | 2> = {
  design_family: 1,
  design_kind: 1,
  procedure: 2,
  fallback: 2,
};

/** Placeholders filled from the chosen procedure (statements only). */
export const PROCEDURE_PLACEHOLDERS = ['param', 'param_words'] as const;

export interface QuestionDef extends Question {
  /** Asked only when this holds (evaluated on earlier answers). */
  guard?: Condition;
  pos: Pos;
}

export interface PredicateDef {
  id: string;
  description: string;
  when: Condition;
  pos: Pos;
}

/** A fact computed from answers with a closed set of operations (no expressions). */
export interface DerivedDef {
  id: string;
  op: 'max' | 'min' | 'ratio';
  args: string[];
  description: string;
  pos: Pos;
}

export interface DesignDef {
  kind: string;
  family: DesignFamily;
  label: string;
  description: string;
  instead?: string;
  pos: Pos;
}

export interface ClassRule {
  id: string;
  when: Condition;
  design: string;
  reasons: string[];
  instead?: string;
  pos: Pos;
}

export interface ProcedureDef {
  id: ProcedureId;
  name: string;
  applies: string;
  nCounting: string;
  df: string;
  estimate: string;
  param: { symbol: string; words: string };
  conditions: string[];
  references: string[];
  pos: Pos;
}

export interface SelectionDef {
  id: string;
  when: Condition;
  procedure: ProcedureId | null;
  /** For family 'other' (no procedure): the name shown instead. */
  name?: string;
  fallback: ProcedureId | null;
  fallbackWhy?: string;
  confidence?: number;
  notes: string[];
  pos: Pos;
}

export interface ConditionDef {
  id: string;
  when?: Condition;
  text: string;
  check: string;
  basis?: string;
  pos: Pos;
}

/** A text chosen by a condition: differences, hypotheses, scope (exactly one applies). */
export interface StatementDef {
  id: string;
  when?: Condition;
  pos: Pos;
}
export interface DifferenceDef extends StatementDef {
  text: string;
}
export interface HypothesesDef extends StatementDef {
  alternative: Alternative;
  nullSymbols: string;
  alternativeSymbols: string;
  nullWords: string;
  alternativeWords: string;
}
export interface ScopeDef extends StatementDef {
  causal: boolean;
  generalize: boolean;
  text: string;
}
/** Warnings and cautions: every one whose condition holds is shown. */
export interface NoteDef extends StatementDef {
  text: string;
}

export interface RuleBase extends RuleBaseView {
  dir: string;
  files: string[];
  questions: QuestionDef[];
  predicates: Map<string, PredicateDef>;
  derived: DerivedDef[];
  designs: Map<string, DesignDef>;
  rules: ClassRule[];
  procedures: Map<ProcedureId, ProcedureDef>;
  selections: SelectionDef[];
  conditions: Map<string, ConditionDef>;
  differences: DifferenceDef[];
  hypotheses: HypothesesDef[];
  scope: ScopeDef[];
  warnings: NoteDef[];
  cautions: NoteDef[];
}
