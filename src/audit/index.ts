/**
 * The audit of a colleague's reported analysis (pure). `auditRecord(record, recommendation)` runs
 * every check over the reported facts and numbers and returns the findings, sorted by severity,
 * plus each number it recomputed. Reading the record lives in src/audit/read.ts; formatting in
 * src/report/audit.ts; recomputation on data in src/audit/on-data.ts.
 *
 * Order matters a little: later checks look at earlier findings to avoid telling the same story
 * twice (a p-value already flagged as one-sided is not compared with the interval again).
 */
import type { Recommendation } from '../engine/types.js';
import { checkCounts } from './check-counts.js';
import { checkDesign } from './check-design.js';
import { checkDirection } from './check-direction.js';
import { checkEffectSize } from './check-effect-size.js';
import { checkEquivalence } from './check-equivalence.js';
import { checkInterval } from './check-interval.js';
import { checkPretest } from './check-pretest.js';
import { checkPValue } from './check-pvalue.js';
import { FINDING_CODES } from './codes.js';
import { makeCollector, makeContext, type AuditContext, type Collector } from './context.js';
import type { AuditRecord, AuditResult, DataComparison, Finding } from './types.js';

export type { AuditRecord, AuditResult, Finding } from './types.js';
export { FINDING_CODES } from './codes.js';

const ORDER = Object.keys(FINDING_CODES);
const RANK = { error: 0, warning: 1, note: 2 } as const;

export interface AuditOptions {
  /** Why there is no recommendation, for the review. */
  recommendationNote?: string;
  /**
   * The data step (src/audit/on-data.ts does the reading): runs after the checks on the reported
   * numbers, adds its findings to `out`, and returns the side-by-side comparison.
   */
  onData?: (ctx: AuditContext, out: Collector) => DataComparison;
}

export function auditRecord(record: AuditRecord, recommendation: Recommendation | null, opts: AuditOptions = {}): AuditResult {
  const { recommendationNote } = opts;
  const ctx = makeContext(record, recommendation, recommendationNote);
  const out = makeCollector();
  checkDesign(ctx, out);
  checkPretest(ctx, out);
  checkCounts(ctx, out);
  checkPValue(ctx, out);
  checkInterval(ctx, out);
  checkDirection(ctx, out);
  checkEffectSize(ctx, out);
  checkEquivalence(ctx, out);
  const data = opts.onData?.(ctx, out);
  const result: AuditResult = { record, recommendation, findings: sortFindings(dedupe(out.findings)), checks: out.checks };
  if (data) result.data = data;
  if (recommendationNote) result.recommendationNote = recommendationNote;
  return result;
}

function sortFindings(fs: Finding[]): Finding[] {
  return [...fs].sort((a, b) => RANK[a.severity] - RANK[b.severity] || ORDER.indexOf(a.code) - ORDER.indexOf(b.code));
}

function dedupe(fs: Finding[]): Finding[] {
  const seen = new Set<string>();
  return fs.filter((f) => {
    const k = `${f.code}\u0000${f.message}`;
    if (seen.has(k)) return false;
    seen.add(k);
    return true;
  });
}

/** Exit status: 1 when any finding is an error. */
export function hasError(result: AuditResult): boolean {
  return result.findings.some((f) => f.severity === 'error');
}
