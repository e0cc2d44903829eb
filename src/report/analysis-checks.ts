/**
 * Reading the diagnostics against the declared procedure's conditions. Nothing here changes the
 * procedure: a diagnostic that contradicts a condition is reported, and the report points to the
 * sensitivity analysis declared in advance.
 *
 * Thresholds, all common practice with no single published source: Shapiro-Wilk p below 0.05;
 * "small" meaning fewer than 30 values; strong skew meaning |skewness| above 1; spreads "unequal"
 * when the larger standard deviation exceeds twice the smaller. Outliers follow the 1.5 x IQR rule;
 * a normal sample has about 0.7% of its values beyond those fences, so in large samples only a
 * clear excess over that share is flagged.
 */
import type { ProcedureId, SampleDiagnostics } from '../stats/types.js';
import { fmt } from './style.js';
import type { DiagnosticFlag } from './analysis-types.js';
import { pIs } from './analysis-conclusion.js';

const SMALL_N = 30;
const STRONG_SKEW = 1;
const SPREAD_RATIO = 2;
/** Share of a normal sample outside the 1.5 x IQR fences: 2 P(Z > 2.698) = 0.00698. */
const NORMAL_OUTLIER_SHARE = 0.00698;

const T_FAMILY: ProcedureId[] = ['paired-t', 'welch-t', 'pooled-t', 'crossover-t', 'paired-equivalence', 'welch-equivalence'];

export function diagnosticFlags(procedure: ProcedureId, diagnostics: SampleDiagnostics[], paired: boolean): DiagnosticFlag[] {
  const flags: DiagnosticFlag[] = [];
  if (T_FAMILY.includes(procedure)) {
    const condition = paired
      ? 'the differences come from a roughly normal distribution, or there are enough of them for their mean to be near-normal'
      : 'each group comes from a roughly normal distribution, or is large enough for its mean to be near-normal';
    for (const d of diagnostics) flags.push(...normality(d, condition));
  }
  if (procedure === 'pooled-t' && diagnostics.length === 2) {
    const [a, b] = diagnostics;
    const ratio = Math.max(a.sd, b.sd) / Math.min(a.sd, b.sd);
    if (ratio > SPREAD_RATIO) {
      flags.push({
        sample: `${a.label} and ${b.label}`,
        check: 'spread',
        severity: 'contradiction',
        condition: 'the two groups have equal spreads (the pooled t assumes it)',
        text: `standard deviations ${fmt(a.sd)} and ${fmt(b.sd)}: the larger is ${fmt(ratio, 3)} times the smaller`,
      });
    }
  }
  if (procedure === 'signed-rank') {
    for (const d of diagnostics) {
      if (d.skewness !== null && Math.abs(d.skewness) > STRONG_SKEW) {
        flags.push({
          sample: d.label,
          check: 'skewness',
          severity: 'contradiction',
          condition: 'the differences are symmetric about their centre (the signed-rank test assumes it)',
          text: `skewness ${fmt(d.skewness, 3)} (strongly ${d.skewness > 0 ? 'right' : 'left'}-skewed)`,
        });
      }
    }
  }
  if (procedure === 'rank-sum' && diagnostics.length === 2) {
    const [a, b] = diagnostics;
    const ratio = Math.max(a.sd, b.sd) / Math.min(a.sd, b.sd);
    if (ratio > SPREAD_RATIO) {
      flags.push({
        sample: `${a.label} and ${b.label}`,
        check: 'shape',
        severity: 'note',
        condition: 'the two groups have the same shape (needed to read the Hodges-Lehmann estimate as a shift)',
        text: `standard deviations ${fmt(a.sd)} and ${fmt(b.sd)} differ by a factor ${fmt(ratio, 3)}: read the result as stochastic superiority (probability of superiority), not as a shift`,
      });
    }
  }
  return flags;
}

function normality(d: SampleDiagnostics, condition: string): DiagnosticFlag[] {
  const out: DiagnosticFlag[] = [];
  const small = d.n < SMALL_N;
  if (d.shapiro && d.shapiro.pValue < 0.05) {
    out.push({
      sample: d.label,
      check: 'shapiro-wilk',
      severity: small ? 'contradiction' : 'note',
      condition,
      text: small
        ? `Shapiro-Wilk W = ${fmt(d.shapiro.w)}, ${pIs(d.shapiro.pValue)} with only ${d.n} values: a departure from normality that so few values cannot average out`
        : `Shapiro-Wilk W = ${fmt(d.shapiro.w)}, ${pIs(d.shapiro.pValue)}; with ${d.n} values the test detects even small departures, and the mean is closer to normal than the values: look at the plot and the skewness`,
    });
  }
  if (d.skewness !== null && Math.abs(d.skewness) > STRONG_SKEW) {
    out.push({
      sample: d.label,
      check: 'skewness',
      severity: 'contradiction',
      condition,
      text: `skewness ${fmt(d.skewness, 3)}: strongly ${d.skewness > 0 ? 'right' : 'left'}-skewed${small ? `, with only ${d.n} values` : ''}`,
    });
  }
  const count = d.outliers.count;
  if (count > 0) {
    const expected = d.n * NORMAL_OUTLIER_SHARE;
    const excess = small || count > 2 * expected + 3;
    const iqr = d.q3 - d.q1;
    const shown = d.outliers.values.slice(0, 5).map((v) => fmt(v)).join(', ');
    out.push({
      sample: d.label,
      check: 'outliers',
      severity: excess ? 'contradiction' : 'note',
      condition,
      text:
        `${count} value${count === 1 ? '' : 's'} beyond 1.5 x IQR from the quartiles (below ${fmt(d.q1 - 1.5 * iqr)} or above ${fmt(d.q3 + 1.5 * iqr)}${shown ? `: ${shown}${count > 5 ? ', ...' : ''}` : ''})` +
        (excess ? (small ? '; in a small sample one such value can move the mean a long way' : `; a normal sample of this size has about ${fmt(expected, 2)}`) : `; about what a normal sample of this size has (${fmt(expected, 2)})`),
    });
  }
  return out;
}
