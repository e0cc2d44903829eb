/**
 * What an analysis run knows, in one plain object: the input side (AnalysisSpec: from a plan or
 * from quick-mode options) and the output side (AnalysisReport: what the text, Markdown and JSON
 * renderers show). The renderers only format; every decision is made in analysis.ts.
 */
import type { ConditionToCheck } from '../engine/types.js';
import type { Alternative, ProcedureId, SampleDiagnostics } from '../stats/types.js';
import type { Strip } from './plot.js';

export interface AnalysisSpec {
  mode: 'plan' | 'quick';
  planFile?: string;
  title: string;
  procedure: ProcedureId;
  options: { alternative: Alternative; confidence: number; nullValue: number; margin?: number };
  /** Declared before seeing the data (plan), or named with --sensitivity (quick mode). */
  sensitivity: { id: ProcedureId; why: string } | null;
  /** Condition names; quick mode takes them from the data (column or level names). */
  labels?: { first: string; second: string };
  outcome: { name?: string; unit?: string; binary: boolean; event?: string };
  /** The measured unit, e.g. "server rack". */
  unitName?: string;
  /** The plan's direction statement; built from the labels when absent. */
  difference?: string;
  /** What the design allows one to claim. */
  scope?: { text: string; causal: boolean; generalize: boolean };
  conditions: ConditionToCheck[];
  warnings: string[];
  cautions: string[];
}

export interface DataInfo {
  file: string;
  layout: string;
  parser: 'fast' | 'full';
  delimiter: string;
  rows: number;
  missingMarkers: string[];
}

/** One procedure's outcome, or why it could not be computed. */
export interface ResultBlock {
  procedure: ProcedureId;
  name: string;
  method: string;
  variant?: string;
  /** False when the statistic cannot be computed from these data (see `unavailable`). */
  available: boolean;
  unavailable?: { code: string; message: string; meaning: string };
  n: { pairs?: number; first?: number; second?: number; dropped: number; zeros?: number; ties?: number };
  estimate: number | null;
  estimateName: string;
  ci: [number, number] | null;
  confidence: number;
  statistic: number | null;
  statisticName: string;
  df: number | null;
  pValue: number | null;
  alternative: Alternative;
  nullValue: number;
  margin?: number;
  /** The level at which the p-value is read for the sentence in the conclusion. */
  alpha: number;
  effectSize: { name: string; formula: string; value: number; ci: [number, number] | null } | null;
  notes: string[];
  details: Record<string, unknown>;
  /** One sentence: what this result says about first versus second. */
  reading: string;
}

/** A diagnostic that bears on a condition of the declared procedure (common practice, no source). */
export interface DiagnosticFlag {
  sample: string;
  check: 'shapiro-wilk' | 'skewness' | 'outliers' | 'spread' | 'shape';
  /** 'contradiction': the condition looks doubtful; 'note': worth knowing, not a contradiction. */
  severity: 'contradiction' | 'note';
  condition: string;
  text: string;
}

export interface AnalysisReport {
  format: 'tandem-analysis/1';
  tool: string;
  title: string;
  mode: 'plan' | 'quick';
  plan: string | null;
  data: DataInfo & { notes: string[]; warnings: string[] };
  labels: { first: string; second: string };
  outcome: { name?: string; unit?: string; binary: boolean; event?: string };
  difference: string;
  main: ResultBlock;
  sensitivity: (ResultBlock & { why: string }) | null;
  diagnostics: SampleDiagnostics[];
  diagnosticsNote?: string;
  flags: DiagnosticFlag[];
  /** What the flags mean for the reading, pointing to the sensitivity result. */
  flagSummary: string | null;
  agreement: string | null;
  conclusion: string;
  scope: string;
  /** Every warning: the plan's (design) and the data's (unequal counts, unmatched ids). */
  warnings: string[];
  /** The plan's warnings alone (the data's are in data.warnings). */
  planWarnings: string[];
  cautions: string[];
  /** What the plot shows (not part of the JSON). */
  plot: { strips: Strip[]; reference?: { value: number; label: string }; legend: string };
}
