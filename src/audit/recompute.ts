/**
 * Recomputing a p-value from a reported statistic, over the range of values the reported digits
 * allow. The reference distribution follows from the procedure and the statistic's name: Student's
 * t with the reported (or implied) df for the t procedures, the standard normal for a z, chi-square
 * with 1 df for McNemar's or the two-proportion chi-square. Rank statistics (W+, U) and exact
 * counts need the data and are not recomputed here.
 *
 * Tails are taken directly from src/stats/distributions.ts (never 1 - F for a small tail).
 * Example: t = 2.14 (so 2.135 to 2.145) with df = 23, two-sided, gives p from 0.0429 to 0.0438.
 */
import { chisqSf, normalCdf, normalSf, tCdf, tQuantile, tSf, normalQuantile } from '../stats/distributions.js';
import type { Alternative } from '../stats/types.js';
import { expectedDf, reportedDfRange } from './check-counts.js';
import type { AuditContext } from './context.js';
import { rangeOver } from './digits.js';
import { T_PROCEDURES } from './procedure-names.js';

export type Reference =
  | { kind: 't'; df: [number, number]; dfText: string }
  | { kind: 'normal' }
  | { kind: 'chisq1' };

export type StatName = 't' | 'z' | 'chi-square' | 'rank' | 'other';

export function statName(ctx: AuditContext): StatName | undefined {
  const raw = (ctx.r.statisticName ?? '').trim().toLowerCase().replace(/[^a-z0-9²χ+]/g, '');
  if (raw === 't') return 't';
  if (raw === 'z') return 'z';
  if (['chisquare', 'chisquared', 'chi2', 'x2', 'χ2', 'χ²', 'chi²'].includes(raw)) return 'chi-square';
  if (['w', 'w+', 'v', 'u', 't+', 's'].includes(raw)) return 'rank';
  if (raw !== '') return 'other';
  if (ctx.used && T_PROCEDURES.includes(ctx.used) && !ctx.used.endsWith('equivalence')) return 't';
  if (ctx.used === 'two-proportions') return 'z';
  if (ctx.used === undefined && ctx.usedFamily && ctx.usedFamily !== 'other' && /\bt\b/.test((ctx.r.procedureText ?? '').toLowerCase())) return 't';
  return undefined;
}

/** The reference distribution of the reported statistic, or why there is none. */
export function referenceOf(ctx: AuditContext): { ref: Reference } | { why: string } {
  const name = statName(ctx);
  if (name === undefined || name === 'other') return { why: 'the statistic and its distribution are not named (set reported.statisticName)' };
  if (name === 'rank') return { why: 'a rank statistic needs the data (or its exact null distribution) to recompute the p-value' };
  if (name === 'z') return { ref: { kind: 'normal' } };
  if (name === 'chi-square') return { ref: { kind: 'chisq1' } };
  const { df } = ctx.r;
  if (df) {
    const range = reportedDfRange(ctx, df);
    if (!(range[0] > 0)) return { why: `the reported df (${df.text}) is not positive` };
    return { ref: { kind: 't', df: range, dfText: df.text } };
  }
  const exp = expectedDf(ctx);
  if (exp && !(exp.range[0] > 0)) return { why: `the df implied by the counts (${exp.basis}) is not positive` };
  if (exp) return { ref: { kind: 't', df: exp.range, dfText: `${exp.basis}, not reported` } };
  return { why: 'df is not reported and cannot be worked out from the counts' };
}

/** The p-value range for a statistic range under the reference and the alternative. */
export function pRange(ref: Reference, stat: [number, number], alt: Alternative): [number, number] {
  if (ref.kind === 'chisq1') {
    return rangeOver([[Math.max(0, stat[0]), Math.max(0, stat[1])]], (x) => chisqSf(x, 1));
  }
  const upper = (x: number, df: number): number => (ref.kind === 't' ? tSf(x, df) : normalSf(x));
  const lower = (x: number, df: number): number => (ref.kind === 't' ? tCdf(x, df) : normalCdf(x));
  const dfBox: [number, number] = ref.kind === 't' ? ref.df : [1, 1];
  if (alt === 'greater') return rangeOver([stat, dfBox], upper);
  if (alt === 'less') return rangeOver([stat, dfBox], lower);
  const abs: [number, number] = stat[0] <= 0 && stat[1] >= 0 ? [0, Math.max(-stat[0], stat[1])] : [Math.min(Math.abs(stat[0]), Math.abs(stat[1])), Math.max(Math.abs(stat[0]), Math.abs(stat[1]))];
  const [lo, hi] = rangeOver([abs, dfBox], (a, df) => 2 * upper(a, df));
  return [Math.min(1, lo), Math.min(1, hi)];
}

/** The critical value for an interval: t (or z) quantile at 1 - (1 - level)/2, or at level when one-sided. */
export function criticalRange(ref: Reference, level: number, oneSided: boolean): [number, number] {
  const p = oneSided ? level : 1 - (1 - level) / 2;
  if (ref.kind === 't') return rangeOver([ref.df], (df) => tQuantile(p, df));
  const z = normalQuantile(p);
  return [z, z];
}

export function altWords(alt: Alternative): string {
  return alt === 'two-sided' ? 'two-sided' : alt === 'greater' ? 'one-sided, greater' : 'one-sided, less';
}
