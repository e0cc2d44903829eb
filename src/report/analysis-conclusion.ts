/**
 * The words of the result: one reading per procedure result, the agreement between the declared
 * procedure and its sensitivity analysis, and the conclusion paragraph. Every sentence names the
 * direction (first minus second) and keeps the outcome's unit; none says more than the design
 * allows (the plan's scope, or a generic statement in quick mode).
 */
import { fmt, fmtP } from './style.js';
import type { ResultBlock } from './analysis-types.js';

export interface Words {
  first: string;
  second: string;
  unit?: string;
  event?: string;
}

export const QUICK_SCOPE =
  'Quick mode has no record of how the data were produced. Whether the difference may be read as caused by the conditions ' +
  '(it may when the conditions, or their order, were assigned at random) and to which units it extends (those the sample ' +
  "fairly represents) depends on the design, which tandem was not told. Write a plan with 'tandem advise' to have this stated.";

/** "p = 0.0123", or "p < 1e-16" below what a double can resolve. */
export function pIs(p: number): string {
  const f = fmtP(p);
  return f.startsWith('<') ? `p ${f}` : `p = ${f}`;
}

export function percent(x: number): string {
  return `${Number((x * 100).toPrecision(6))}%`;
}

/** A number with the outcome's unit, e.g. "0.35 degrees C". */
export function withUnit(x: number, w: Words): string {
  return w.unit ? `${fmt(x)} ${w.unit}` : fmt(x);
}

/** "0.31 to 0.39 degrees C", "at least 0.31 degrees C", "at most 0.39". */
export function intervalWords(ci: [number, number], w: Words): string {
  const [a, b] = ci;
  if (Number.isFinite(a) && Number.isFinite(b)) return `${fmt(a)} to ${withUnit(b, w)}`;
  if (Number.isFinite(a)) return `at least ${withUnit(a, w)}`;
  if (Number.isFinite(b)) return `at most ${withUnit(b, w)}`;
  return 'unbounded';
}

/** "mean difference (first minus second): 0.35 degrees C, 95% interval 0.31 to 0.39 degrees C" */
export function estimateWords(r: ResultBlock, w: Words): string {
  if (!r.available || r.estimate === null) return `${r.name}: not computed`;
  const ci = r.ci ? `, ${percent(r.confidence)} interval ${intervalWords(r.ci, w)}` : '';
  return `${r.estimateName}: ${withUnit(r.estimate, w)}${ci}`;
}

/** What one result says about first versus second, in one sentence. */
export function reading(r: ResultBlock, w: Words): string {
  if (!r.available || r.pValue === null || r.estimate === null) return r.unavailable ? `not computed: ${r.unavailable.meaning}` : 'not computed';
  const p = pIs(r.pValue);
  const level = percent(r.alpha);
  if (r.procedure === 'paired-equivalence' || r.procedure === 'welch-equivalence') {
    const m = r.margin ?? Number(r.details.margin);
    const inside = r.pValue < r.alpha;
    const range = `the equivalence range -${fmt(m)} to ${withUnit(m, w)}`;
    return inside
      ? `equivalence shown at the ${level} level (${p}, the larger of the two one-sided p-values): the ${percent(r.confidence)} interval lies inside ${range}`
      : `equivalence not shown at the ${level} level (${p}): the ${percent(r.confidence)} interval reaches beyond ${range}; this is not evidence of a difference either`;
  }
  if (byInterval(r)) {
    // A difference procedure beside an equivalence test, or a yes/no outcome with an equivalence
    // margin: judged by its interval, not its p-value.
    const ci = r.ci ? `${percent(r.confidence)} interval ${intervalWords(r.ci, w)}` : `${percent(r.confidence)} interval`;
    const m = r.margin!;
    const range = `the equivalence range -${fmt(m)} to ${withUnit(m, w)}`;
    return insideMargin(r)
      ? `equivalence shown by the interval: the ${ci} lies inside ${range}`
      : `equivalence not shown by the interval: the ${ci} reaches beyond ${range}`;
  }
  const up = r.estimate > r.nullValue;
  const claim = (higher: boolean): string => {
    if (r.nullValue !== 0) return `the difference (${w.first} minus ${w.second}) is ${higher ? 'above' : 'below'} ${withUnit(r.nullValue, w)}`;
    switch (r.procedure) {
      case 'signed-rank':
        return `the differences (${w.first} minus ${w.second}) tend to be ${higher ? 'positive' : 'negative'}: ${w.first} typically gives ${higher ? 'higher' : 'lower'} values than ${w.second}`;
      case 'rank-sum':
        return `values under ${w.first} tend to be ${higher ? 'higher' : 'lower'} than under ${w.second}, in the sense of stochastic superiority (not a statement about medians)`;
      case 'mcnemar':
      case 'two-proportions':
        return `the event${w.event ? ` ('${w.event}')` : ''} is ${higher ? 'more' : 'less'} frequent under ${w.first} than under ${w.second}`;
      default:
        return `${w.first} gives ${higher ? 'higher' : 'lower'} values than ${w.second} on average`;
    }
  };
  const significant = r.pValue < r.alpha;
  if (r.alternative === 'two-sided') {
    if (significant) return `the data indicate that ${claim(up)} (${p}, below ${level})`;
    const ci = r.ci ? `; differences from ${intervalWords(r.ci, w)} remain compatible with the data` : '';
    // With a null value other than zero the test asked whether the difference departs from that
    // value, not whether the two conditions differ: say so, rather than "no difference".
    if (r.nullValue !== 0) {
      return `the data do not show that the difference (${w.first} minus ${w.second}) departs from ${withUnit(r.nullValue, w)} at the ${level} level (${p})${ci}; this is not evidence that it equals ${fmt(r.nullValue)}`;
    }
    return `the data do not show a difference between ${w.first} and ${w.second} at the ${level} level (${p})${ci}; this is not evidence that they are the same`;
  }
  const wanted = r.alternative === 'greater';
  if (significant) return `the data indicate that ${claim(wanted)} (${p}, one-sided, below ${level})`;
  return `the data do not show that ${claim(wanted)} at the ${level} level (${p}, one-sided)`;
}

/** A result with a margin that is not a TOST procedure: its interval, not its p-value, decides. */
function byInterval(r: ResultBlock): boolean {
  return r.margin !== undefined && r.procedure !== 'paired-equivalence' && r.procedure !== 'welch-equivalence';
}

/** Whether a result judged by its interval against a margin has that interval inside the margin. */
function insideMargin(r: ResultBlock): boolean {
  return r.ci !== null && r.margin !== undefined && r.ci[0] > -r.margin && r.ci[1] < r.margin;
}

/** Whether the sensitivity analysis leads to the same reading as the declared procedure. */
export function agreement(main: ResultBlock, sens: ResultBlock | null, doubts: boolean, w: Words): string | null {
  if (!sens) return null;
  if (!main.available || main.pValue === null || main.estimate === null) return null;
  if (!sens.available || sens.pValue === null || sens.estimate === null) {
    return `The sensitivity analysis (${sens.name}) could not be computed: ${sens.unavailable?.meaning ?? 'see above'}.`;
  }
  // The readings agree when both are significant or both are not; two significant two-sided
  // results must also point the same way. Two non-significant results say the same thing ("not
  // shown") whatever the signs of their estimates, and a one-sided result's direction is fixed by
  // the alternative.
  const judged = byInterval(sens);
  const mainSig = byInterval(main) ? insideMargin(main) : main.pValue < main.alpha;
  const sensSig = judged ? insideMargin(sens) : sens.pValue < sens.alpha;
  const sameWay = Math.sign(main.estimate - main.nullValue) === Math.sign(sens.estimate - sens.nullValue);
  const same = mainSig === sensSig && (!mainSig || main.alternative !== 'two-sided' || sameWay);
  const evidence = judged && sens.ci ? `its ${percent(sens.confidence)} interval ${intervalWords(sens.ci, w)}` : pIs(sens.pValue);
  if (same) {
    return `The sensitivity analysis (${sens.name}) agrees with the declared procedure (${evidence})` + (doubts ? '; the conclusion does not hinge on the condition in doubt.' : '.');
  }
  return (
    `The sensitivity analysis (${sens.name}) does not agree (${judged ? '' : `${pIs(sens.pValue)}: `}${sens.reading}). ` +
    'The conclusion depends on the conditions of the procedure used: report both results and treat the declared one with caution.'
  );
}
