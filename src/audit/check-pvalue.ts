/**
 * The p-value against the statistic, df and sidedness. The p-value is recomputed over every value
 * the reported digits allow (statistic ± half a unit, df ± half a unit when written rounded) and
 * must meet the reported p ± half a unit in its last written place. When it does not, the
 * one-sided counterpart is tried: a halved or doubled p is the commonest slip.
 *
 * Example: t = 2.14, df = 23 allows a two-sided p from 0.0429 to 0.0438, so "0.043" passes and
 * "0.022" is flagged as the one-sided value reported as two-sided.
 */
import type { Alternative } from '../stats/types.js';
import type { AuditContext, Collector } from './context.js';
import { isRange, overlaps, rangeOf, showRange } from './digits.js';
import { altWords, pRange, referenceOf } from './recompute.js';
import type { ReportedNumber } from './types.js';

/** The reported p as a range; "0.000" becomes "< 0.0005" (a p-value is never zero). */
export function pRangeReported(p: ReportedNumber): [number, number] {
  if (p.value === 0 && !p.bound) return [0, p.halfUnit];
  const [lo, hi] = rangeOf(p);
  return [Math.max(0, lo), Math.min(1, hi)];
}

export function checkPValue(ctx: AuditContext, out: Collector): void {
  const { pValue, statistic } = ctx.r;
  if (!pValue) return;
  if (pValue.value > 1 || pValue.value < 0 || (pValue.bound?.startsWith('<') && pValue.value <= 0) || (pValue.bound?.startsWith('>') && pValue.value >= 1)) {
    out.add('p-impossible', `The reported p-value ${pValue.text} is impossible: a p-value lies above 0 and at most 1.`, 'Check the software output and copy the p-value again.');
    return;
  }
  if (pValue.value === 0 && !pValue.bound) {
    out.add('p-written-as-zero', `The p-value is written as ${pValue.text}; a p-value is never zero, only smaller than the printed precision.`, `Write it as a bound, e.g. p < ${pValue.halfUnit * 2}.`);
  }
  if (!statistic || ctx.used?.endsWith('equivalence')) return;
  const ref = referenceOf(ctx);
  const stated = ctx.r.alternative;
  const alt: Alternative = stated ?? 'two-sided';
  const reported = pRangeReported(pValue);
  if ('why' in ref) {
    out.check({ what: 'p-value from the statistic', reported: pValue.text, expected: null, ok: null, note: `not recomputed: ${ref.why}` });
    return;
  }
  const stat = rangeOf(statistic);
  const expected = pRange(ref.ref, stat, alt);
  if (!isRange(expected)) {
    out.check({ what: 'p-value from the statistic', reported: pValue.text, expected: null, ok: null, note: 'not recomputed: the statistic and df give no p-value' });
    return;
  }
  const ok = overlaps(expected, reported);
  const from = `${ref.ref.kind === 'chisq1' ? 'chi-square' : ref.ref.kind === 'normal' ? 'z' : 't'} = ${statistic.text}${ref.ref.kind === 't' ? `, df ${ref.ref.dfText}` : ref.ref.kind === 'chisq1' ? ', 1 df' : ''}`;
  out.check({ what: `p-value (${altWords(alt)}${stated ? '' : ', assumed'}, from ${from})`, reported: pValue.text, expected, ok });
  if (ok || ref.ref.kind === 'chisq1') {
    if (!ok) addInconsistent(ctx, out, pValue, expected, alt, from, !stated);
    return;
  }
  if (alt === 'two-sided') {
    const oneSided = pRange(ref.ref, stat, statistic.value >= 0 ? 'greater' : 'less');
    if (overlaps(oneSided, reported)) {
      out.add('p-other-sidedness',
        `The reported p = ${pValue.text} is the one-sided p-value for ${from} (${showRange(oneSided)}); the two-sided p-value is ${showRange(expected)}.${stated ? '' : ' The record does not state the alternative; if the test was planned one-sided before seeing the data, say so and give the direction.'}`,
        stated
          ? 'Report the two-sided p-value, or, if a one-sided test was pre-declared, state the alternative and the direction of subtraction.'
          : 'State whether the test was one- or two-sided, and report the matching p-value.',
        { expectedLow: expected[0], expectedHigh: expected[1], oneSidedLow: oneSided[0], oneSidedHigh: oneSided[1] });
      return;
    }
  } else {
    const two = pRange(ref.ref, stat, 'two-sided');
    if (overlaps(two, reported)) {
      out.add('p-other-sidedness',
        `The test is stated as ${altWords(alt)}, but the reported p = ${pValue.text} is the two-sided p-value for ${from}; the one-sided p-value is ${showRange(expected)}.`,
        'Report the p-value that matches the stated alternative (or state the test as two-sided).',
        { expectedLow: expected[0], expectedHigh: expected[1] });
      return;
    }
    const opposite = pRange(ref.ref, stat, alt === 'greater' ? 'less' : 'greater');
    const against = alt === 'greater' ? statistic.value < 0 : statistic.value > 0;
    if (against && overlaps(opposite, reported)) return; // the direction check explains it (sign-vs-direction)
  }
  addInconsistent(ctx, out, pValue, expected, alt, from, !stated);
}

function addInconsistent(ctx: AuditContext, out: Collector, p: ReportedNumber, expected: [number, number], alt: Alternative, from: string, assumed: boolean): void {
  out.add('p-inconsistent',
    `The reported p = ${p.text} does not follow from ${from} (${altWords(alt)}${assumed ? ', assumed' : ''}): allowing for the rounding of every reported digit, it should be ${showRange(expected)}.`,
    `Recompute the p-value from the statistic and df (or check that the statistic, df and p-value were copied from the same analysis of ${ctx.usedLabel}).`,
    { reportedP: p.value, expectedLow: expected[0], expectedHigh: expected[1] });
}
