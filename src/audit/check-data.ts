/**
 * Findings from the data (pure, given the pairing account and both recomputations): repeated ids,
 * ids or rows without their partner, counts that kept incomplete pairs, reported numbers that the
 * colleague's own procedure does not reproduce, and a decision that changes between the
 * colleague's procedure and the recommended one.
 */
import type { TestResult } from '../stats/types.js';
import { unitNames, type AuditContext, type Collector } from './context.js';
import { pRangeReported } from './check-pvalue.js';
import { overlaps, rangeOf, show } from './digits.js';
import type { PairingAccount } from './pairing.js';
import type { DataComparison, ReportedNumber } from './types.js';

/** `interval` is the colleague's result whose interval matches the reported one (two-sided when both ends are reported). */
export function checkData(ctx: AuditContext, out: Collector, acc: PairingAccount, cmp: DataComparison, interval: TestResult | null = cmp.colleague.result): void {
  const { one: unit, many: units } = unitNames(ctx);
  if (acc.duplicates.length > 0) {
    const list = acc.duplicates.slice(0, 5).map((d) => `${d.id} (${d.times} times, lines ${d.lines.join(', ')})`).join('; ');
    out.add('data-duplicate-ids',
      `${acc.duplicates.length} id${acc.duplicates.length === 1 ? ' occurs' : 's occur'} more than once within one condition: ${list}. Each ${unit} must give one value per condition; with repeats it is unclear which value belongs in the pair, and the ${unit} is counted more than once.`,
      `Find out why the ${unit} was entered twice (a re-measurement, a typing slip, two ${units} sharing an id); keep one value per ${unit} and condition, or average the repeats, then re-run.`,
      { duplicates: acc.duplicates.length });
  }
  if (acc.pairs !== undefined && acc.incomplete > 0) {
    out.add('data-unmatched-ids',
      `${acc.incomplete} ${acc.incomplete === 1 ? `${unit} has` : `${units} have`} a value under one condition only${acc.unmatched.length ? ` (${acc.unmatched.slice(0, 8).join(', ')}${acc.unmatched.length > 8 ? ', ...' : ''})` : ''}. A paired analysis drops such incomplete pairs whole; ${acc.pairs} complete pairs remain.`,
      'Report how many pairs were incomplete and why; if the missing values are not missing by chance (e.g. the worst units dropped out), say how that could bias the result.',
      { incomplete: acc.incomplete, pairs: acc.pairs });
    checkIncompleteKept(ctx, out, acc);
  }
  checkReproduced(ctx, out, cmp.colleague.result, interval);
  const a = cmp.colleague.result;
  const b = cmp.recommended?.result;
  if (a && b && a.procedure !== b.procedure) {
    const alpha = ctx.alpha;
    if (a.pValue <= alpha !== b.pValue <= alpha) {
      out.add('data-conclusion-changes',
        `On the same data the colleague's ${cmp.colleague.label} gives p = ${show(a.pValue, 3)}, the recommended ${cmp.recommended!.label} gives p = ${show(b.pValue, 3)}: at the level ${alpha} the decision ${a.pValue <= alpha ? 'no longer holds' : 'changes to a detected difference'}.`,
        `Report the recommended analysis (estimate ${show(b.estimate)}, interval ${show(b.ci[0])} to ${show(b.ci[1])}) as the result, and correct the conclusion.`,
        { colleagueP: a.pValue, recommendedP: b.pValue });
    }
  }
}

/** A paired analysis whose reported n counts values that have no partner. */
function checkIncompleteKept(ctx: AuditContext, out: Collector, acc: PairingAccount): void {
  if (ctx.usedFamily !== 'paired' || acc.pairs === undefined) return;
  const { n, n1, n2 } = ctx.r;
  const alone = [acc.firstValues.length, acc.secondValues.length];
  const bad = (x?: ReportedNumber): boolean => x !== undefined && x.value !== acc.pairs && alone.includes(x.value);
  if (bad(n) || bad(n1) || bad(n2)) {
    out.add('data-incomplete-kept',
      `The reported counts (${[n && `n = ${n.text}`, n1 && `n1 = ${n1.text}`, n2 && `n2 = ${n2.text}`].filter(Boolean).join(', ')}) match the values available per condition (${alone.join(' and ')}), not the ${acc.pairs} complete pairs: values without a partner were kept.`,
      `Drop incomplete pairs whole and re-run on the ${acc.pairs} complete pairs; report how many were dropped.`);
  }
}

/** The colleague's procedure on the data must give the reported numbers (to their digits). */
function checkReproduced(ctx: AuditContext, out: Collector, res: TestResult | null, interval: TestResult | null): void {
  if (!res || res.procedure === 'signed-rank' || res.procedure === 'rank-sum') return;
  const r = ctx.r;
  const misses: string[] = [];
  const cmp = (what: string, rep: ReportedNumber | undefined, value: number | null | undefined, range?: [number, number]): void => {
    if (!rep || value === null || value === undefined || !Number.isFinite(value)) return;
    const ok = overlaps(range ?? rangeOf(rep), [value, value], 1e-9);
    out.check({ what: `${what} (recomputed on the data)`, reported: rep.text, expected: [value, value], ok });
    if (!ok) misses.push(`${what} ${rep.text} (data: ${show(value, 5)})`);
  };
  const n = res.n.pairs ?? (res.n.first !== undefined && res.n.second !== undefined ? res.n.first + res.n.second : undefined);
  if (r.n && n !== undefined && !out.has('n-counts-observations') && !out.has('data-incomplete-kept')) cmp('n', r.n, n);
  if (res.n.pairs === undefined) {
    cmp('n1', r.n1, res.n.first);
    cmp('n2', r.n2, res.n.second);
  }
  cmp('estimate', r.estimate, res.estimate);
  if (r.statistic && !res.procedure.endsWith('equivalence')) cmp('statistic', r.statistic, res.statistic);
  if (r.df && res.df !== null) cmp('df', r.df, res.df, r.df.halfUnit >= 0.5 && res.procedure.startsWith('welch') ? [r.df.value - 0.5, r.df.value + 1] : undefined);
  if (r.pValue && !res.procedure.endsWith('equivalence')) cmp('p-value', r.pValue, res.pValue, pRangeReported(r.pValue));
  cmp('interval lower end', r.ci?.lower, (interval ?? res).ci[0]);
  cmp('interval upper end', r.ci?.upper, (interval ?? res).ci[1]);
  if (misses.length) {
    out.add('data-reported-differs',
      `Run on the data as the colleague describes it (${res.method}), the numbers differ from the report: ${misses.join('; ')}.`,
      'Check that the reported numbers come from this data file and this procedure (same exclusions, same subtraction, same alternative and level); re-run and copy the numbers again.',
      { estimate: res.estimate, statistic: res.statistic, df: res.df, pValue: res.pValue });
  }
}
