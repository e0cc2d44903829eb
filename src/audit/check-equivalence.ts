/**
 * Equivalence by two one-sided tests (Schuirmann 1987). With margin m, the lower test asks whether
 * the difference exceeds -m (t_L = (estimate + m) / se, p_L = P(T > t_L)) and the upper test
 * whether it stays below +m (t_U = (estimate - m) / se, p_U = P(T < t_U)). Equivalence is shown
 * only when BOTH reject: the decision p-value is the larger of the two, and the 1 - 2α interval
 * lies inside [-m, m]. Deciding on the smaller p-value claims equivalence when only one side holds.
 *
 * A non-significant difference test is not evidence of equivalence ("absence of evidence is not
 * evidence of absence", Altman and Bland 1995).
 *
 * Example: p_L = 0.003, p_U = 0.081 at α = 0.05: not shown equivalent (0.081 > 0.05).
 */
import { tCdf, tSf } from '../stats/distributions.js';
import type { AuditContext, Collector } from './context.js';
import { pRangeReported } from './check-pvalue.js';
import { estimateRange, independentSe } from './check-interval.js';
import { isRange, overlaps, rangeOf, rangeOver, showRange } from './digits.js';
import { referenceOf } from './recompute.js';

export function checkEquivalence(ctx: AuditContext, out: Collector): void {
  const { r } = ctx;
  const eq = r.equivalence;
  const isTost = ctx.used?.endsWith('equivalence') || eq !== undefined;
  const a = ctx.alpha;
  const claimsEq = r.claim === 'equivalent' || eq?.decision === 'equivalent';
  // A margin is fixed in advance, not measured: its written value is exact.
  const margin = eq?.margin ? rangeOf(eq.margin, true) : ctx.rec?.procedure.margin !== undefined ? ([ctx.rec.procedure.margin, ctx.rec.procedure.margin] as [number, number]) : undefined;
  if (!isTost) {
    if ((r.claim === 'no-difference' || r.claim === 'equivalent') && (!r.pValue || pRangeReported(r.pValue)[1] > a || r.claim === 'equivalent')) {
      out.add('absence-as-equivalence',
        `The report concludes "${r.claim === 'equivalent' ? 'equivalent' : 'no difference'}" from a test of difference${r.pValue ? ` (p = ${r.pValue.text})` : ''}. A non-significant difference shows only that the data cannot tell; a small study fails to find even large differences.`,
        'Say "no difference was detected" and give the interval, or run an equivalence test (two one-sided tests) against a margin fixed in advance.');
    }
    if (r.claim === 'equivalent' && !margin) noMargin(out);
    return;
  }
  if (claimsEq && !margin) noMargin(out);
  if (!eq) return;
  const pL = eq.pLower ? pRangeReported(eq.pLower) : undefined;
  const pU = eq.pUpper ? pRangeReported(eq.pUpper) : undefined;
  if (pL && pU) {
    const larger: [number, number] = [Math.max(pL[0], pU[0]), Math.max(pL[1], pU[1])];
    const smaller: [number, number] = [Math.min(pL[0], pU[0]), Math.min(pL[1], pU[1])];
    const distinct = !overlaps(larger, smaller);
    const decisionP = eq.decisionP ? pRangeReported(eq.decisionP) : undefined;
    const usedSmaller = distinct && ((decisionP && overlaps(decisionP, smaller) && !overlaps(decisionP, larger)) || (eq.decision === 'equivalent' && larger[0] > a && smaller[1] <= a));
    const largerText = pL[1] >= pU[1] ? eq.pLower!.text : eq.pUpper!.text;
    const smallerText = pL[1] >= pU[1] ? eq.pUpper!.text : eq.pLower!.text;
    if (usedSmaller) {
      out.add('equivalence-smaller-p',
        `Equivalence was decided with the smaller one-sided p-value (${smallerText}) instead of the larger (${largerText}). Both one-sided tests must reject; the larger p-value is the decision p-value${larger[0] > a ? `, and at ${+a.toFixed(4)} it does not show equivalence` : ''}.`,
        `Report the larger one-sided p-value (${largerText}) as the equivalence p-value and decide with it; equivalently, check that the ${Math.round((1 - 2 * a) * 100)}% interval lies inside the margin.`);
    } else if ((eq.decision === 'equivalent' && larger[0] > a) || (eq.decision === 'not-equivalent' && larger[1] <= a)) {
      out.add('equivalence-decision',
        `The decision "${eq.decision}" contradicts the one-sided p-values ${eq.pLower!.text} and ${eq.pUpper!.text}: the larger is ${larger[0] > a ? 'above' : 'at or below'} ${+a.toFixed(4)}.`,
        'Decide with the larger one-sided p-value against the stated level.');
    }
  }
  checkIntervalAgainstMargin(ctx, out, margin);
  recomputeOneSided(ctx, out, margin);
}

function noMargin(out: Collector): void {
  out.add('equivalence-no-margin',
    'Equivalence is claimed, but no equivalence margin is stated. Without a margin fixed in advance, "equivalent" has no meaning: any difference is equivalent within a wide enough margin.',
    "State the margin in the outcome's unit (the largest difference that would not matter in practice), with the reason for it, decided before seeing the data.");
}

function checkIntervalAgainstMargin(ctx: AuditContext, out: Collector, margin?: [number, number]): void {
  const { ci } = ctx.r;
  const eq = ctx.r.equivalence!;
  if (!margin || !ci?.lower || !ci.upper || eq.decision !== 'equivalent' || out.has('equivalence-decision') || out.has('equivalence-smaller-p')) return;
  const lo = rangeOf(ci.lower);
  const hi = rangeOf(ci.upper);
  if (lo[1] < -margin[1] || hi[0] > margin[1]) {
    out.add('equivalence-decision',
      `Equivalence is claimed, but the interval ${ci.lower.text} to ${ci.upper.text} reaches beyond the margin ±${eq.margin?.text ?? margin[0]}. Equivalence requires the whole ${Math.round((1 - 2 * ctx.alpha) * 100)}% interval inside the margin.`,
      'Report "equivalence not shown" (or a larger study), unless the margin was fixed wider in advance.');
  }
}

/** Recomputes both one-sided p-values from estimate, SE, df and margin when the report gives them. */
function recomputeOneSided(ctx: AuditContext, out: Collector, margin?: [number, number]): void {
  const eq = ctx.r.equivalence!;
  const est = estimateRange(ctx);
  const se = independentSe(ctx);
  const ref = referenceOf({ ...ctx, r: { ...ctx.r, statisticName: 't' } });
  if (!margin || !est || !se || 'why' in ref || ref.ref.kind !== 't') return;
  const df = ref.ref.df;
  const sides: [string, typeof eq.pLower, [number, number]][] = [
    ['lower', eq.pLower, rangeOver([est, se.range, margin, df], (e, s, m, d) => tSf((e + m) / s, d))],
    ['upper', eq.pUpper, rangeOver([est, se.range, margin, df], (e, s, m, d) => tCdf((e - m) / s, d))],
  ];
  for (const [side, rep, exp] of sides) {
    if (!rep || !isRange(exp)) continue;
    const ok = overlaps(exp, pRangeReported(rep));
    out.check({ what: `one-sided p against the ${side} margin (${se.basis})`, reported: rep.text, expected: exp, ok });
    if (!ok) {
      out.add('p-inconsistent',
        `The one-sided p-value against the ${side} margin, ${rep.text}, does not follow from the estimate, its SE (${se.basis}), df and the margin: it should be ${showRange(exp)}.`,
        'Recompute both one-sided tests: t = (estimate + margin) / SE for the lower, (estimate - margin) / SE for the upper.',
        { expectedLow: exp[0], expectedHigh: exp[1] });
    }
  }
}
