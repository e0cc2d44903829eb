/**
 * Counts and degrees of freedom. In a paired analysis n is the number of complete pairs and
 * df = pairs - 1; the pooled two-sample t has df = n1 + n2 - 2; Welch's df (Welch 1947,
 * Satterthwaite 1946) lies between min(n1, n2) - 1 and n1 + n2 - 2 and equals
 *   (s1²/n1 + s2²/n2)² / [ (s1²/n1)²/(n1 - 1) + (s2²/n2)²/(n2 - 1) ];
 * the 2x2 crossover analysis compares two sequence groups, so df = n1 + n2 - 2 (Hills and
 * Armitage 1979).
 *
 * Example: a paired t with "n = 24" and "df = 11" counted the 24 measurements of 12 pairs.
 */
import { unitNames, type AuditContext, type Collector } from './context.js';
import { rangeOf, rangeOver, showRange } from './digits.js';
import type { ReportedNumber } from './types.js';

export interface DfExpectation {
  range: [number, number];
  /** How it follows, for messages: "pairs - 1 = 11". */
  basis: string;
}

/** The number of pairs a paired analysis used, as far as the reported counts tell. */
export function pairsOf(ctx: AuditContext): number | undefined {
  const { n, n1, n2, df } = ctx.r;
  if (n && !countsObservations(ctx)) return n.value;
  if (n && countsObservations(ctx)) return n.value / 2;
  if (n1 && n2 && n1.value === n2.value) return n1.value;
  if (df && Number.isInteger(df.value) && df.halfUnit >= 0.5) return df.value + 1;
  return undefined;
}

/** True when a paired analysis reports n as the number of measurements (twice the pairs). */
function countsObservations(ctx: AuditContext): boolean {
  const { n, n1, n2, df } = ctx.r;
  if (ctx.usedFamily !== 'paired' || !n) return false;
  if (df && Number.isInteger(df.value) && n.value === 2 * (df.value + 1)) return true;
  if (n1 && n2 && n1.value === n2.value && n.value === n1.value + n2.value) return true;
  return false;
}

function groupCounts(ctx: AuditContext): [number, number] | undefined {
  const { n1, n2 } = ctx.r;
  return n1 && n2 ? [n1.value, n2.value] : undefined;
}

/** Welch-Satterthwaite df over the rounding of the reported SDs. */
export function welchDf(s1: ReportedNumber, s2: ReportedNumber, n1: number, n2: number): [number, number] {
  return rangeOver([rangeOf(s1), rangeOf(s2)], (a, b) => {
    const v1 = (a * a) / n1;
    const v2 = (b * b) / n2;
    return (v1 + v2) ** 2 / (v1 * v1 / (n1 - 1) + v2 * v2 / (n2 - 1));
  });
}

/** The df the procedure implies from the reported counts (and SDs for Welch), if they tell. */
export function expectedDf(ctx: AuditContext): DfExpectation | undefined {
  const used = ctx.used;
  const { n } = ctx.r;
  if (used === 'paired-t' || used === 'paired-equivalence') {
    // From n (halved when it counts measurements) or equal per-condition counts; not from df itself.
    const g = groupCounts(ctx);
    const pairs = n ? (countsObservations(ctx) ? n.value / 2 : n.value) : g && g[0] === g[1] ? g[0] : undefined;
    return pairs !== undefined ? { range: [pairs - 1, pairs - 1], basis: `pairs - 1 = ${pairs} - 1` } : undefined;
  }
  const g = groupCounts(ctx);
  if (used === 'pooled-t' || used === 'crossover-t') {
    if (g) return { range: [g[0] + g[1] - 2, g[0] + g[1] - 2], basis: `n1 + n2 - 2 = ${g[0]} + ${g[1]} - 2` };
    if (n) return { range: [n.value - 2, n.value - 2], basis: `n - 2 = ${n.value} - 2` };
    return undefined;
  }
  if (used === 'welch-t' || used === 'welch-equivalence') {
    if (!g) return undefined;
    const s1 = ctx.first?.sd;
    const s2 = ctx.second?.sd;
    if (s1 && s2 && g[0] > 1 && g[1] > 1) {
      const range = welchDf(s1, s2, g[0], g[1]);
      return { range, basis: `the Welch-Satterthwaite formula with SDs ${s1.text} and ${s2.text}, n1 = ${g[0]}, n2 = ${g[1]}` };
    }
    return { range: [Math.min(g[0], g[1]) - 1, g[0] + g[1] - 2], basis: `between min(n1, n2) - 1 = ${Math.min(g[0], g[1]) - 1} and n1 + n2 - 2 = ${g[0] + g[1] - 2}` };
  }
  return undefined;
}

/**
 * The range of true df the written df allows. A Welch df written as a whole number may have been
 * rounded or cut down to a whole number (both are common), so [df - 0.5, df + 1) is allowed.
 */
export function reportedDfRange(ctx: AuditContext, df: ReportedNumber): [number, number] {
  const welch = ctx.used === 'welch-t' || ctx.used === 'welch-equivalence';
  if (welch && df.halfUnit >= 0.5) return [df.value - 0.5, df.value + 1 - 1e-9];
  if (Number.isInteger(df.value) && df.halfUnit >= 0.5) return [df.value, df.value];
  return rangeOf(df);
}

export function checkCounts(ctx: AuditContext, out: Collector): void {
  const { n, n1, n2, df } = ctx.r;
  if (countsObservations(ctx)) {
    const pairs = n!.value / 2;
    out.add('n-counts-observations',
      `The paired analysis reports n = ${n!.text}, but ${df ? `df = ${df.text} implies ${pairs} pairs` : `each condition has ${n1!.text} values, so there are ${pairs} pairs`}. In a paired analysis n is the number of pairs (here ${pairs}), not the number of measurements (${n!.text}).`,
      `Report n = ${pairs} pairs (and df = ${pairs - 1}); say how many pairs were incomplete and dropped.`,
      { reportedN: n!.value, pairs });
  }
  if (ctx.usedFamily === 'independent' && n && n1 && n2 && n.value !== n1.value + n2.value) {
    out.add('n-inconsistent', `The total n = ${n.text} does not equal n1 + n2 = ${n1.value + n2.value}.`, 'Check which count is right and report n1 and n2 per group.');
  }
  if (ctx.usedFamily === 'paired' && n1 && n2 && n1.value !== n2.value) {
    out.add('n-inconsistent',
      `The counts per condition differ (${n1.text} and ${n2.text}), but a paired analysis uses complete pairs only, so both conditions must have the same count.`,
      'Drop incomplete pairs as whole pairs, report the number of complete pairs, and say how many were dropped.');
  }
  if (!df || !ctx.used) return;
  const exp = expectedDf(ctx);
  if (!exp) return;
  const got = reportedDfRange(ctx, df);
  const ok = got[0] <= exp.range[1] + 1e-9 && exp.range[0] <= got[1] + 1e-9;
  out.check({ what: `df (${exp.basis})`, reported: df.text, expected: exp.range, ok });
  if (ok) return;
  const pooledLike = (ctx.used === 'welch-t' || ctx.used === 'welch-equivalence') && n1 && n2 && df.value === n1.value + n2.value - 2;
  const fewerPairs = ctx.usedFamily === 'paired' && n && Number.isInteger(df.value) && df.value + 1 < n.value;
  out.add('df-inconsistent',
    `The reported df = ${df.text} does not fit ${ctx.usedLabel}: with the reported counts it should be ${showRange(exp.range)} (${exp.basis}).${pooledLike ? ' The value is the pooled df; the pooled t may have been run instead of Welch.' : ''}${fewerPairs ? ` df = ${df.text} implies ${df.value + 1} pairs: n may count ${unitNames(ctx).many} whose pair is incomplete.` : ''}`,
    `Recompute df from the number of ${ctx.usedFamily === 'paired' ? 'complete pairs' : 'values per group'} actually analysed and check that the stated procedure is the one that was run.`,
    { reportedDf: df.value, expectedLow: exp.range[0], expectedHigh: exp.range[1] });
}
