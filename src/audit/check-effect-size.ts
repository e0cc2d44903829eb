/**
 * Effect sizes and their formulas. The same word "d" covers different quantities:
 *   d_z      = mean difference / SD of the differences = t / √pairs (paired; Cohen 1988, Lakens 2013)
 *   d_av     = mean difference / ((s1 + s2) / 2) (paired; Cumming 2012)
 *   d pooled = (m1 - m2) / pooled SD = t_pooled · √(1/n1 + 1/n2) (independent; Cohen 1988)
 *   Hedges' g = d pooled · J, J = Γ(df/2) / (√(df/2) · Γ((df - 1)/2)), df = n1 + n2 - 2 (Hedges 1981)
 *   Glass's delta = (m1 - m2) / s2 (Glass 1976)
 * With positively correlated pairs d_z is larger than d_av, so a d reported with a paired test
 * must say which it is; d_z has no meaning for independent groups, which have no differences.
 *
 * Example: paired t = 3.10 with 16 pairs gives d_z = 3.10 / 4 = 0.775.
 */
import { gammaln } from '../stats/distributions.js';
import type { AuditContext, Collector } from './context.js';
import { pairsOf } from './check-counts.js';
import { isRange, overlaps, rangeOf, rangeOver, showRange } from './digits.js';
import type { EffectFormula } from './types.js';

const FORMULA_WORDS: Record<EffectFormula, string> = {
  'd-z': 'd_z (mean difference / SD of the differences)',
  'd-av': 'd_av (mean difference / average of the two SDs)',
  'd-pooled': 'd with the pooled SD of the two sets',
  'hedges-g': "Hedges' g (pooled-SD d with small-sample correction)",
  'glass-delta': "Glass's delta (difference / SD of the second condition)",
  'rank-biserial': 'rank-biserial correlation',
  'probability-of-superiority': 'probability of superiority',
  'odds-ratio': 'odds ratio',
  'risk-difference': 'risk difference',
  unstated: 'an unstated formula',
};

const POOLED_LIKE: EffectFormula[] = ['d-pooled', 'd-av', 'hedges-g', 'glass-delta'];

/** Hedges' exact small-sample correction J(df). */
export function hedgesJ(df: number): number {
  return Math.exp(gammaln(df / 2) - 0.5 * Math.log(df / 2) - gammaln((df - 1) / 2));
}

export function checkEffectSize(ctx: AuditContext, out: Collector): void {
  const es = ctx.r.effectSize;
  if (!es) return;
  const label = es.name ? `"${es.name}"` : 'The effect size';
  const independent = ctx.usedFamily === 'independent' || (ctx.usedFamily === undefined && ctx.design?.family === 'independent');
  if (es.formula === 'unstated') {
    out.add('effect-size-unnamed', `${label} is reported without its formula, so a reader cannot tell whether it divides by the SD of the differences, a pooled SD or an average SD; the values can differ a lot.`, 'Name the formula beside the value (for a paired design d_z = mean difference / SD of the differences is the usual choice; say so).');
    return;
  }
  if (ctx.usedFamily === 'paired' && POOLED_LIKE.includes(es.formula) && !es.formulaStated) {
    out.add('effect-size-formula',
      `${label} was computed as ${FORMULA_WORDS[es.formula]} but reported with a paired test without saying so. Readers of a paired analysis expect d_z (mean difference / SD of the differences); the two differ by the correlation within pairs, so the reported value can be far from what they assume.`,
      'Say which formula was used beside the value, or report d_z = t / √pairs for the paired analysis (optionally also d_av for comparison with independent-groups studies).');
  } else if (independent && es.formula === 'd-z') {
    out.add('effect-size-dz-independent',
      `${label} is given as d_z, the mean difference over the SD of the differences, but the groups are independent: there are no within-unit differences, so d_z cannot be computed.`,
      "Report Hedges' g (pooled-SD d with small-sample correction) or the plain difference in the outcome's unit.");
  } else if (!es.formulaStated) {
    out.add('effect-size-unnamed', `${label} (${FORMULA_WORDS[es.formula]}) is reported without naming its formula.`, 'Name the formula beside the value.');
  }
  checkValue(ctx, out);
}

function checkValue(ctx: AuditContext, out: Collector): void {
  const es = ctx.r.effectSize!;
  if (!es.value) return;
  const expected = expectedValue(ctx, es.formula);
  if (!expected || !isRange(expected.range)) return;
  const rep = rangeOf(es.value);
  const mirrored: [number, number] = [-expected.range[1], -expected.range[0]];
  const ok = overlaps(expected.range, rep) || (es.value.value >= 0 && overlaps(mirrored, rep));
  out.check({ what: `effect size ${FORMULA_WORDS[es.formula]} (${expected.basis})`, reported: es.value.text, expected: expected.range, ok });
  if (ok) return;
  out.add('effect-size-inconsistent',
    `The effect size ${es.value.text} does not follow from the other reported numbers by its formula: ${FORMULA_WORDS[es.formula]} from ${expected.basis} gives ${showRange(expected.range, 3)}.`,
    'Recompute the effect size with the formula named, from the same n and spread as the test; if another formula was used, name it.',
    { expectedLow: expected.range[0], expectedHigh: expected.range[1] });
}

function expectedValue(ctx: AuditContext, f: EffectFormula): { range: [number, number]; basis: string } | undefined {
  const { statistic, estimate, sd } = ctx.r;
  const m1 = ctx.first?.mean;
  const m2 = ctx.second?.mean;
  const s1 = ctx.first?.sd;
  const s2 = ctx.second?.sd;
  const n1 = ctx.r.n1?.value;
  const n2 = ctx.r.n2?.value;
  const paired = ctx.usedFamily === 'paired';
  if (f === 'd-z' && paired) {
    if (estimate && sd) return { range: rangeOver([rangeOf(estimate), rangeOf(sd)], (e, s) => e / s), basis: `estimate ${estimate.text} / SD of differences ${sd.text}` };
    const pairs = pairsOf(ctx);
    if (statistic && pairs && (ctx.used === 'paired-t')) return { range: rangeOver([rangeOf(statistic)], (t) => t / Math.sqrt(pairs)), basis: `t ${statistic.text} / √${pairs}` };
    return undefined;
  }
  if (m1 && m2 && s1 && s2) {
    const box: [number, number][] = [rangeOf(m1), rangeOf(m2), rangeOf(s1), rangeOf(s2)];
    const means = `means ${m1.text} and ${m2.text}, SDs ${s1.text} and ${s2.text}`;
    if (f === 'd-av') return { range: rangeOver(box, (a, b, c, d) => (a - b) / ((c + d) / 2)), basis: means };
    if (f === 'glass-delta') return { range: rangeOver(box, (a, b, _c, d) => (a - b) / d), basis: means };
    if ((f === 'd-pooled' || f === 'hedges-g') && (paired || (n1 && n2))) {
      const w1 = paired ? 1 : n1! - 1;
      const w2 = paired ? 1 : n2! - 1;
      const j = f === 'hedges-g' && !paired ? hedgesJ(n1! + n2! - 2) : 1;
      return { range: rangeOver(box, (a, b, c, d) => (j * (a - b)) / Math.sqrt((w1 * c * c + w2 * d * d) / (w1 + w2))), basis: means };
    }
    return undefined;
  }
  if ((f === 'd-pooled' || f === 'hedges-g') && ctx.used === 'pooled-t' && statistic && n1 && n2) {
    const j = f === 'hedges-g' ? hedgesJ(n1 + n2 - 2) : 1;
    return { range: rangeOver([rangeOf(statistic)], (t) => j * t * Math.sqrt(1 / n1 + 1 / n2)), basis: `pooled t ${statistic.text} × √(1/${n1} + 1/${n2})` };
  }
  return undefined;
}
