/**
 * The sample-size report: one sentence that answers the question in the study's own words and
 * units, a line on how it was computed, the table of what pairing buys, and a power curve drawn
 * with plain characters. Colour only through the Style from style.ts.
 */
import type { SizePlan } from '../size/index.js';
import type { ComparisonRow, CurvePoint, SizeSpec } from '../size/types.js';
import { fmt, textTable, type Style } from './style.js';

/** Words from the plan (or options) to speak in the study's terms. */
export interface SizeContext {
  unit?: string;
  outcome?: string;
  outcomeUnit?: string;
  first?: string;
  second?: string;
}

const CAUTION =
  'A planning aid: it does not replace a qualified statistician, an ethics review or a protocol\'s pre-specified analysis plan; local regulation and licensed practice come first.';

export function renderSize(plan: SizePlan, ctx: SizeContext, style: Style): string {
  const out: string[] = [style.bold(answerSentence(plan, ctx))];
  out.push(style.dim(detailLine(plan)));
  for (const n of plan.notes) out.push(style.dim(`Note: ${n}.`));
  if (plan.comparison) out.push('', comparisonTable(plan.comparison, plan.spec, ctx, style));
  if (plan.curve.length > 1) out.push('', curvePlot(plan.curve, plan.spec, plan.answer.layout.n, style));
  out.push('', style.dim(CAUTION), '');
  return out.join('\n');
}

const pct = (p: number): string => `${fmt(100 * p, 3)}%`;

function amount(v: number, spec: SizeSpec, ctx: SizeContext, sdWord = 'SD'): string {
  if (spec.standardized) return `${fmt(v, 3)} ${sdWord}`;
  return ctx.outcomeUnit ? `${fmt(v, 4)} ${ctx.outcomeUnit}` : fmt(v, 4);
}

function plural(word: string): string {
  if (/(s|x|z|ch|sh)$/.test(word)) return `${word}es`;
  if (/[^aeiou]y$/.test(word)) return `${word.slice(0, -1)}ies`;
  return `${word}s`;
}

/** "23 pairs" or "64 glaze tiles in each group (128 in all)". */
export function countPhrase(spec: SizeSpec, n: number, n2: number | undefined, ctx: SizeContext): string {
  if (spec.design === 'paired') return `${n} ${n === 1 ? 'pair' : 'pairs'}`;
  const noun = ctx.unit ? plural(ctx.unit) : 'units';
  if (n2 === undefined || n2 === n) return `${n} ${noun} in each group (${n + (n2 ?? n)} in all)`;
  const a = ctx.first ? ` (${ctx.first})` : '';
  const b = ctx.second ? ` (${ctx.second})` : '';
  return `${n} ${noun} in the first group${a} and ${n2} in the second${b} (${n + n2} in all)`;
}

function spreadPhrase(spec: SizeSpec, ctx: SizeContext): string {
  if (spec.design === 'paired') {
    if (spec.standardized) {
      return spec.rho === undefined ? 'in SDs of the differences' : `in SDs of single measurements; correlation ${fmt(spec.rho, 3)} within pairs`;
    }
    if (spec.rho !== undefined && spec.sd !== undefined) {
      return `SD ${amount(spec.sd, spec, ctx)}, correlation ${fmt(spec.rho, 3)} within pairs, so SD of differences ${amount(spec.sdDiff, spec, ctx)}`;
    }
    return `SD of differences ${amount(spec.sdDiff, spec, ctx)}`;
  }
  if (spec.standardized) return 'in SDs of single measurements';
  const sd = spec.sd as number;
  if (spec.sd2 !== undefined && spec.sd2 !== sd) return `SD ${amount(sd, spec, ctx)} in the first group and ${amount(spec.sd2, spec, ctx)} in the second`;
  return `SD ${amount(sd, spec, ctx)} in each group`;
}

/** "a mean difference (A minus B) of 2.5 mm (SD of differences 4 mm)" or its standardized form. */
function effectPhrase(spec: SizeSpec, diff: number, ctx: SizeContext): string {
  const what = spec.design === 'paired' ? 'a mean difference' : 'a difference in means';
  const labels = ctx.first && ctx.second ? ` (${ctx.first} minus ${ctx.second})` : '';
  const of = ctx.outcome ? ` in ${ctx.outcome}` : '';
  if (spec.standardized) {
    if (spec.design === 'paired' && spec.rho === undefined) return `${what}${of}${labels} of ${fmt(diff, 3)} SD of the differences (d_z = ${fmt(diff, 3)})`;
    if (spec.design === 'paired') {
      return `${what}${of}${labels} of ${fmt(diff, 3)} SD of single measurements (d = ${fmt(diff, 3)}; correlation ${fmt(spec.rho as number, 3)} within pairs, so d_z = ${fmt(diff / spec.sdDiff, 3)})`;
    }
    return `${what}${of}${labels} of ${fmt(diff, 3)} SD (d = ${fmt(diff, 3)})`;
  }
  return `${what}${of}${labels} of ${amount(diff, spec, ctx)} (${spreadPhrase(spec, ctx)})`;
}

function testPhrase(spec: SizeSpec): string {
  if (spec.alternative === 'two-sided') return `two-sided alpha ${fmt(spec.alpha, 3)}`;
  const dir = spec.alternative === 'greater' ? 'positive' : 'negative';
  return `one-sided alpha ${fmt(spec.alpha, 3)} (looking only for a ${dir} difference)`;
}

function recruitPhrase(plan: SizePlan): string {
  const { spec, answer } = plan;
  if (!(spec.attrition > 0)) return '';
  const r = answer.recruit;
  const what = spec.design === 'paired' ? `${r.n}` : r.n2 === undefined || r.n2 === r.n ? `${r.n} per group (${r.total} in all)` : `${r.n} and ${r.n2} (${r.total} in all)`;
  return `; recruit ${what} to allow for ${fmt(100 * spec.attrition, 3)}% attrition`;
}

export function answerSentence(plan: SizePlan, ctx: SizeContext): string {
  const { spec, answer } = plan;
  const l = answer.layout;
  const count = countPhrase(spec, l.n, l.n2, ctx);
  if (spec.margin !== undefined) {
    const conf = fmt(100 * (1 - 2 * spec.alpha), 3);
    const lead = `To show that the mean difference lies within plus or minus ${amount(spec.margin, spec, ctx)} (two one-sided tests at alpha ${fmt(spec.alpha, 3)}: the ${conf}% confidence interval inside the margin), when the true difference is ${amount(spec.difference, spec, ctx)} (${spreadPhrase(spec, ctx)})`;
    if (answer.question === 'power') return `${lead}, ${count} give ${pct(answer.power)} power.`;
    return `${lead}, with ${pct(spec.power)} power you need ${count}${recruitPhrase(plan)}.`;
  }
  if (answer.question === 'power') {
    return `With ${count}, ${effectPhrase(spec, answer.difference, ctx)} would be detected with ${pct(answer.power)} power at ${testPhrase(spec)}.`;
  }
  if (answer.question === 'detectable-difference') {
    const sdWord = spec.design === 'paired' && spec.rho === undefined ? 'SD of the differences' : 'SD';
    const std = spec.standardized ? '' : ` (${fmt(answer.difference / (spec.design === 'paired' ? spec.sdDiff : (spec.sd as number)), 3)} ${spec.design === 'paired' ? 'SD of the differences' : 'SD'})`;
    return `With ${count} and ${pct(spec.power)} power at ${testPhrase(spec)}, the smallest true difference you can expect to detect is ${amount(answer.difference, spec, ctx, sdWord)}${std}.`;
  }
  if (answer.atMinimum) {
    return `To detect ${effectPhrase(spec, spec.difference, ctx)} with ${pct(spec.power)} power at ${testPhrase(spec)}, the smallest possible study, ${count}, is already enough (power ${pct(answer.power)})${recruitPhrase(plan)}.`;
  }
  return `To detect ${effectPhrase(spec, spec.difference, ctx)} with ${pct(spec.power)} power at ${testPhrase(spec)} you need ${count}${recruitPhrase(plan)}.`;
}

function detailLine(plan: SizePlan): string {
  const { answer, spec } = plan;
  const l = answer.layout;
  const parts = [`Power at this size ${pct(answer.power)}`, `${fmt(l.df, 4)} degrees of freedom`];
  if (answer.question === 'sample-size' && !answer.atMinimum) {
    const below = spec.design === 'paired' ? `${l.n - 1} pairs` : l.n2 === l.n ? `${l.n - 1} per group` : `${l.n - 1} in the first group`;
    parts[0] += ` (${below} would fall short)`;
  }
  return `${parts.join('; ')}. Method: ${answer.method}.`;
}

function comparisonTable(rows: ComparisonRow[], spec: SizeSpec, ctx: SizeContext, style: Style): string {
  const g = rows[0];
  const groups = `${g.independentTotal} (${g.independentN} + ${g.independentN2})`;
  const head = [['correlation', 'SD of differences', 'pairs needed', 'measurements', 'two groups', 'measurements saved']];
  const body = rows.map((r) => {
    const mine = spec.design === 'paired' && spec.rho !== undefined && Math.abs(spec.rho - r.rho) < 1e-9;
    return [fmt(r.rho, 2) + (mine ? ' *' : ''), amount(r.sdDiff, spec, ctx), String(r.pairs), String(2 * r.pairs), groups, String(r.independentTotal - 2 * r.pairs)];
  });
  const sigma = spec.standardized ? 'effects in SDs of single measurements' : `SD of single measurements ${amount(g.sigma, spec, ctx)}`;
  const title = style.bold(`What pairing buys (same question; ${sigma})`);
  const foot = style.dim(
    'A pair gives two measurements, a unit in two groups one. At correlation 0 pairing gains nothing and costs degrees of freedom (a negative saving); the gain grows with the correlation within pairs.' +
      (spec.design === 'paired' && spec.rho !== undefined ? ' * your planned correlation.' : ''),
  );
  return [title, textTable([...head, ...body], { right: [0, 2, 3, 5], indent: '  ' }), foot].join('\n');
}


/** Power (rows, 0% to 100%) against n (columns), the target as a dashed line, the answer marked. */
export function curvePlot(curve: CurvePoint[], spec: SizeSpec, answerN: number, style: Style): string {
  const H = 10;
  const rowOf = (p: number): number => Math.round(p * H);
  const target = rowOf(spec.power);
  const lines: string[] = [];
  const what = spec.design === 'paired' ? 'pairs' : 'first-group size';
  lines.push(style.bold(`Power against ${what}`));
  for (let r = H; r >= 0; r--) {
    const label = r % 5 === 0 ? `${r * 10}%`.padStart(5) : r === target ? `${fmt(spec.power * 100, 3)}%`.padStart(5) : '     ';
    let row = '';
    for (const pt of curve) {
      const onCurve = rowOf(pt.power) === r;
      if (onCurve) row += pt.n === answerN ? style.accent('@') : style.accent('*');
      else if (r === target) row += style.dim('-');
      else row += ' ';
    }
    lines.push(`${label} |${row}`.trimEnd());
  }
  lines.push(`      +${'-'.repeat(curve.length)}`);
  const idx = curve.findIndex((p) => p.n === answerN);
  const first = String(curve[0].n);
  const last = String(curve[curve.length - 1].n);
  let axis = ' '.repeat(curve.length + 2);
  const put = (s: string, at: number): void => {
    const start = Math.max(0, Math.min(axis.length - s.length, at));
    axis = axis.slice(0, start) + s + axis.slice(start + s.length);
  };
  put(first, 0);
  put(last, curve.length + 1 - last.length);
  if (idx >= 0) put(`^${answerN}`, idx);
  lines.push(`       ${axis.trimEnd()}`);
  lines.push(style.dim(`  * exact power at each size, @ at ${answerN}, - the target ${pct(spec.power)}`));
  return lines.join('\n');
}

/**
 * The --json result. `n` is pairs or the first group's size, `total` the units analysed, `power`
 * the exact power achieved at that size; `recruit` adds attrition; `inputs` holds what was given
 * and `assumed` what the calculation used (spreads after conversion, defaults).
 */
export function sizeJson(plan: SizePlan, given: object, ctx: SizeContext): Record<string, unknown> {
  const { spec, answer } = plan;
  const l = answer.layout;
  return {
    question: answer.question,
    design: spec.design,
    n: l.n,
    ...(l.n2 !== undefined ? { n2: l.n2 } : {}),
    total: l.total,
    power: answer.power,
    difference: answer.difference,
    recruit: answer.recruit,
    df: l.df,
    ...(answer.ncp !== undefined ? { ncp: answer.ncp } : {}),
    standardError: l.se,
    atMinimum: answer.atMinimum,
    method: answer.method,
    inputs: given,
    assumed: {
      alpha: spec.alpha, power: spec.power, alternative: spec.alternative, attrition: spec.attrition,
      sdDiff: spec.design === 'paired' ? spec.sdDiff : undefined, sd: spec.sd, sd2: spec.sd2, rho: spec.rho,
      ratio: spec.design === 'independent' ? spec.ratio : undefined, margin: spec.margin, standardized: spec.standardized,
      outcomeUnit: ctx.outcomeUnit,
    },
    comparison: plan.comparison,
    curve: plan.curve,
    notes: plan.notes,
  };
}
