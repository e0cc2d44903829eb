/**
 * The estimate, its standard error, the statistic and the interval, checked against each other.
 * For a t procedure t = (estimate - 0) / se and the interval is estimate ± c·se, with c the t
 * quantile at 1 - (1 - level)/2 and the procedure's df. The standard error comes from the report
 * when given (or from the SD of differences and the pairs, or from the group SDs), else from the
 * statistic itself (se = estimate / t). Every quantity ranges over what its written digits allow.
 *
 * Example: estimate 1.84, t = 2.14, df = 23, 95%: se = 0.860, c = 2.069, interval 0.06 to 3.62.
 */
import type { AuditContext, Collector } from './context.js';
import { pairsOf } from './check-counts.js';
import { pRangeReported } from './check-pvalue.js';
import { gap, isRange, overlaps, rangeOf, rangeOver, showRange } from './digits.js';
import { criticalRange, referenceOf, statName, type Reference } from './recompute.js';

/** The standard error from numbers other than the statistic, if the report gives them. */
export function independentSe(ctx: AuditContext): { range: [number, number]; basis: string } | undefined {
  const { se, sd } = ctx.r;
  if (se) return { range: rangeOf(se), basis: `the reported SE ${se.text}` };
  const pairs = pairsOf(ctx);
  if (ctx.usedFamily === 'paired' && sd && pairs) {
    return { range: rangeOver([rangeOf(sd)], (s) => s / Math.sqrt(pairs)), basis: `SD of differences ${sd.text} / √${pairs}` };
  }
  const s1 = ctx.first?.sd;
  const s2 = ctx.second?.sd;
  const n1 = ctx.r.n1?.value;
  const n2 = ctx.r.n2?.value;
  if (ctx.usedFamily === 'independent' && s1 && s2 && n1 && n2) {
    if (ctx.used === 'pooled-t') {
      return {
        range: rangeOver([rangeOf(s1), rangeOf(s2)], (a, b) => Math.sqrt((((n1 - 1) * a * a + (n2 - 1) * b * b) / (n1 + n2 - 2)) * (1 / n1 + 1 / n2))),
        basis: `the pooled SD of ${s1.text} and ${s2.text}`,
      };
    }
    if (ctx.used === 'welch-t' || ctx.used === 'welch-equivalence') {
      return { range: rangeOver([rangeOf(s1), rangeOf(s2)], (a, b) => Math.sqrt((a * a) / n1 + (b * b) / n2)), basis: `√(s1²/n1 + s2²/n2) with SDs ${s1.text} and ${s2.text}` };
    }
  }
  return undefined;
}

/** The estimate as reported, or the difference of the reported means. */
export function estimateRange(ctx: AuditContext): [number, number] | undefined {
  if (ctx.r.estimate) return rangeOf(ctx.r.estimate);
  const m1 = ctx.first?.mean;
  const m2 = ctx.second?.mean;
  if (m1 && m2) return rangeOver([rangeOf(m1), rangeOf(m2)], (a, b) => a - b);
  return undefined;
}

export function checkInterval(ctx: AuditContext, out: Collector): void {
  const { estimate, statistic, ci } = ctx.r;
  const tProc = statName(ctx) === 't' && !ctx.used?.endsWith('equivalence');
  checkEstimateAgainstMeans(ctx, out);
  const est = estimateRange(ctx);
  if (tProc && est && statistic) {
    const t = rangeOf(statistic);
    if ((est[0] > 0 && t[1] < 0) || (est[1] < 0 && t[0] > 0)) {
      out.add('statistic-estimate-sign',
        `The statistic (${statistic.text}) and the estimate (${estimate?.text ?? showRange(est)}) have opposite signs; for ${ctx.usedLabel} the statistic is the estimate divided by its standard error, so they share a sign.`,
        'Check that the estimate and the statistic come from the same subtraction (first minus second) and the same analysis.');
    }
    const se = independentSe(ctx);
    if (se && se.range[0] > 0 && !out.has('statistic-estimate-sign')) {
      const expected = rangeOver([est, se.range], (e, s) => e / s);
      const ok = !isRange(expected) || overlaps(expected, t);
      out.check({ what: `statistic (estimate / SE, SE from ${se.basis})`, reported: statistic.text, expected, ok });
      if (!ok) {
        out.add('statistic-inconsistent',
          `The statistic ${statistic.text} does not follow from the estimate and its standard error (${se.basis}): estimate / SE gives ${showRange(expected)}.`,
          'Check that the statistic, estimate and spread were taken from the same analysis, with the same n.',
          { expectedLow: expected[0], expectedHigh: expected[1] });
      }
    }
  }
  if (!ci || (!ci.lower && !ci.upper)) return;
  const lower = ci.lower ? rangeOf(ci.lower) : undefined;
  const upper = ci.upper ? rangeOf(ci.upper) : undefined;
  if (ci.lower && ci.upper && ci.lower.value > ci.upper.value) {
    out.add('ci-inconsistent', `The interval's lower end ${ci.lower.text} is above its upper end ${ci.upper.text}.`, 'Write the interval as lower end to upper end, both from the same subtraction (first minus second).');
    return;
  }
  if (est && ((lower && est[1] < lower[0]) || (upper && est[0] > upper[1]))) {
    out.add('ci-excludes-estimate',
      `The estimate (${estimate?.text ?? showRange(est)}) lies outside its own interval (${ci.lower?.text ?? '-infinity'} to ${ci.upper?.text ?? 'infinity'}).`,
      'Check the sign of the estimate and of the interval: both must come from the same subtraction. Swapping first and second flips the estimate and both ends of the interval.');
    return;
  }
  if (!tProc || !est) return;
  const ref = referenceOf(ctx);
  if ('why' in ref) {
    out.check({ what: 'confidence interval', reported: `${ci.lower?.text ?? ''} to ${ci.upper?.text ?? ''}`, expected: null, ok: null, note: `not recomputed: ${ref.why}` });
    return;
  }
  const se = independentSe(ctx);
  if (!se && !statistic) return;
  const oneSided = !(lower && upper) && ctx.r.alternative !== undefined && ctx.r.alternative !== 'two-sided';
  const ends = (level: number, r: Reference, sided: boolean): { lo: [number, number]; hi: [number, number] } => {
    const c = criticalRange(r, level, sided);
    const sRange = se ? se.range : undefined;
    const box: [number, number][] = sRange ? [est, sRange, c] : [est, rangeOf(statistic!), c];
    const seOf = (e: number, x: number): number => (sRange ? x : Math.abs(e / x));
    return {
      lo: rangeOver(box, (e, x, k) => e - k * seOf(e, x)),
      hi: rangeOver(box, (e, x, k) => e + k * seOf(e, x)),
    };
  };
  const fits = (p: { lo: [number, number]; hi: [number, number] }): boolean => (!lower || overlaps(p.lo, lower)) && (!upper || overlaps(p.hi, upper));
  const pred = ends(ctx.confidence, ref.ref, oneSided);
  if (!isRange(pred.lo) || !isRange(pred.hi)) {
    out.check({ what: 'confidence interval', reported: `${ci.lower?.text ?? ''} to ${ci.upper?.text ?? ''}`, expected: null, ok: null, note: 'not recomputed: the standard error cannot be derived (a zero statistic or SE)' });
    return;
  }
  const ok = fits(pred);
  const levelText = `${Math.round(ctx.confidence * 1000) / 10}%`;
  out.check({ what: `interval lower end (${levelText}, ${se ? se.basis : 'SE = estimate / statistic'})`, reported: ci.lower?.text ?? 'none', expected: lower ? pred.lo : null, ok: lower ? overlaps(pred.lo, lower) : null });
  out.check({ what: `interval upper end (${levelText})`, reported: ci.upper?.text ?? 'none', expected: upper ? pred.hi : null, ok: upper ? overlaps(pred.hi, upper) : null });
  if (!ok) {
    const hint = diagnose(ctx, ref.ref, oneSided, ends, fits);
    out.add('ci-inconsistent',
      `The ${levelText} interval ${ci.lower?.text ?? '-infinity'} to ${ci.upper?.text ?? 'infinity'} does not follow from the estimate and its standard error (${se ? se.basis : 'SE = estimate / statistic'}): allowing for rounding it should run from ${lower ? showRange(pred.lo, 3) : '-infinity'} to ${upper ? showRange(pred.hi, 3) : 'infinity'}.${hint}`,
      `Recompute the interval as estimate ± critical value × SE with the procedure's df and the stated level, or state the level that was used.`,
      { lowerFrom: pred.lo[0], lowerTo: pred.lo[1], upperFrom: pred.hi[0], upperTo: pred.hi[1] });
    return;
  }
  checkIntervalAgainstP(ctx, out, lower, upper);
}

/** Names a likely cause when another level, the normal quantile or a one-sided bound fits. */
function diagnose(ctx: AuditContext, ref: Reference, oneSided: boolean, ends: (l: number, r: Reference, s: boolean) => { lo: [number, number]; hi: [number, number] }, fits: (p: { lo: [number, number]; hi: [number, number] }) => boolean): string {
  for (const level of [0.9, 0.95, 0.99, 0.8]) {
    if (Math.abs(level - ctx.confidence) > 1e-9 && fits(ends(level, ref, oneSided))) return ` It matches a ${level * 100}% level instead.`;
  }
  if (ref.kind === 't' && fits(ends(ctx.confidence, { kind: 'normal' }, oneSided))) return ' It matches the normal quantile instead of the t quantile with the procedure\'s df.';
  return '';
}

function checkEstimateAgainstMeans(ctx: AuditContext, out: Collector): void {
  const { estimate } = ctx.r;
  const m1 = ctx.first?.mean;
  const m2 = ctx.second?.mean;
  if (!estimate || !m1 || !m2 || !['paired-t', 'welch-t', 'pooled-t', 'paired-equivalence', 'welch-equivalence'].includes(ctx.used ?? '')) return;
  const expected = rangeOver([rangeOf(m1), rangeOf(m2)], (a, b) => a - b);
  const rep = rangeOf(estimate);
  if (overlaps(expected, rep)) return;
  const names = ctx.r.difference ? `${ctx.r.difference.first} minus ${ctx.r.difference.second}` : 'first minus second';
  if (overlaps([-expected[1], -expected[0]], rep) && gap([-expected[1], -expected[0]], rep) === 0) {
    out.add('sign-vs-direction',
      `The estimate ${estimate.text} is the difference of the reported means taken the other way round: ${names} is ${showRange(expected)}. The subtraction that was run is not the one the report states.`,
      `State the subtraction that was actually computed, or recompute as ${names}; flip the signs of the estimate, the statistic and the interval together.`);
    return;
  }
  out.add('estimate-inconsistent',
    `The estimate ${estimate.text} does not equal the difference of the reported means (${names} = ${showRange(expected)}).${ctx.usedFamily === 'paired' ? ' In a paired analysis this holds when both means are taken over the complete pairs only.' : ''}`,
    'Check that the means and the estimate come from the same values (complete pairs, same exclusions).');
}

/** A two-sided interval and a two-sided p-value must agree about the null value 0. */
function checkIntervalAgainstP(ctx: AuditContext, out: Collector, lower?: [number, number], upper?: [number, number]): void {
  const p = ctx.r.pValue;
  if (!p || !lower || !upper || (ctx.r.alternative && ctx.r.alternative !== 'two-sided')) return;
  if (out.has('p-inconsistent') || out.has('p-other-sidedness')) return;
  const a = 1 - ctx.confidence;
  const pr = pRangeReported(p);
  const excludes = lower[0] > 0 || upper[1] < 0;
  const includes = lower[1] < 0 && upper[0] > 0;
  const level = `${Math.round(ctx.confidence * 1000) / 10}%`;
  if ((excludes && pr[0] > a) || (includes && pr[1] < a)) {
    out.add('ci-p-disagree',
      `The ${level} interval ${excludes ? 'excludes' : 'includes'} 0 but the two-sided p = ${p.text} is ${excludes ? 'above' : 'below'} ${+a.toFixed(4)}; for ${ctx.usedLabel} the two always agree, so one of them comes from another analysis or was mistyped.`,
      'Recompute both from the same analysis and report them together.');
  }
}
