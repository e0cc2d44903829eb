/**
 * The analysis as JSON (`--json`), format `tandem-analysis/1`. The declared procedure's fields sit
 * at the top level (procedure, n, estimate, ci, confidence, statistic, df, pValue, alternative,
 * effectSize), the sensitivity analysis has the same fields under `sensitivity`. JSON has no
 * infinity: the open end of a one-sided interval is written as null, and `ciNote` says so.
 */
import type { AnalysisReport, ResultBlock } from './analysis-types.js';

const OPEN_END = 'null marks an infinite end: a one-sided interval is open on that side';

function block(r: ResultBlock): Record<string, unknown> {
  const open = (ci: [number, number] | null | undefined): boolean => !!ci && ci.some((x) => !Number.isFinite(x));
  const out: Record<string, unknown> = {
    procedure: r.procedure,
    name: r.name,
    method: r.method,
    ...(r.variant ? { variant: r.variant } : {}),
    available: r.available,
    ...(r.unavailable ? { unavailable: r.unavailable } : {}),
    n: r.n,
    estimate: r.estimate,
    estimateName: r.estimateName,
    ci: r.ci,
    confidence: r.confidence,
    statistic: r.statistic,
    statisticName: r.statisticName,
    df: r.df,
    pValue: r.pValue,
    alternative: r.alternative,
    nullValue: r.nullValue,
    ...(r.margin !== undefined ? { margin: r.margin } : {}),
    effectSize: r.effectSize,
    reading: r.reading,
    notes: r.notes,
    details: r.details,
  };
  if (open(r.ci) || open(r.effectSize?.ci)) out.ciNote = OPEN_END;
  return out;
}

export function analysisJson(a: AnalysisReport): string {
  const doc = {
    format: a.format,
    tool: a.tool,
    title: a.title,
    mode: a.mode,
    plan: a.plan,
    data: a.data,
    labels: a.labels,
    outcome: a.outcome,
    difference: a.difference,
    ...block(a.main),
    diagnostics: a.diagnostics,
    ...(a.diagnosticsNote ? { diagnosticsNote: a.diagnosticsNote } : {}),
    flags: a.flags,
    flagSummary: a.flagSummary,
    sensitivity: a.sensitivity ? { ...block(a.sensitivity), why: a.sensitivity.why } : null,
    agreement: a.agreement,
    conclusion: a.conclusion,
    scope: a.scope,
    warnings: a.warnings,
    cautions: a.cautions,
  };
  return JSON.stringify(doc, (_k, v: unknown) => (typeof v === 'number' && !Number.isFinite(v) ? null : v), 2) + '\n';
}
