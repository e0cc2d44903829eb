/**
 * Pieces the text and Markdown renderers share: the rows of a result, of the diagnostics table,
 * and line wrapping. Kept apart so that both show the same numbers in the same words.
 */
import type { SampleDiagnostics } from '../stats/types.js';
import { fmt, fmtP } from './style.js';
import { intervalWords, percent, withUnit, type Words, pIs } from './analysis-conclusion.js';
import type { AnalysisReport, ResultBlock } from './analysis-types.js';

export function wordsOf(a: AnalysisReport): Words {
  return { first: a.labels.first, second: a.labels.second, unit: a.outcome.unit, event: a.outcome.event };
}

/** Equivalence procedures run two one-sided tests; their alternative field stays 'two-sided'. */
const TOST = new Set(['paired-equivalence', 'welch-equivalence']);
const SIDES: Record<string, string> = { 'two-sided': 'two-sided', greater: 'one-sided, first greater', less: 'one-sided, first less' };

/** [label, value] rows describing one result. */
export function resultRows(r: ResultBlock, w: Words): [string, string][] {
  if (!r.available) {
    return [
      ['result', `not computed (${r.unavailable?.code})`],
      ['why', r.unavailable?.message ?? ''],
      ['meaning', r.unavailable?.meaning ?? ''],
      ['used', countsText(r)],
    ];
  }
  const rows: [string, string][] = [
    ['estimate', `${withUnit(r.estimate!, w)}  (${r.estimateName})`],
    ['interval', r.ci ? `${percent(r.confidence)}: ${intervalWords(r.ci, w)}` : 'none'],
    ['test', `${r.statisticName} = ${fmt(r.statistic)}${r.df !== null ? ` on ${fmt(r.df, 6)} df` : ''}, ${pIs(r.pValue!)} (${TOST.has(r.procedure) ? 'two one-sided tests' : SIDES[r.alternative]}${r.nullValue !== 0 ? `, null value ${fmt(r.nullValue)}` : ''})`],
  ];
  if (r.margin !== undefined) rows.push(['margin', `equivalence range -${fmt(r.margin)} to ${withUnit(r.margin, w)}`]);
  if (r.effectSize) {
    const e = r.effectSize;
    const ci = e.ci ? `, ${percent(r.confidence)} interval ${fmtInterval(e.ci)}` : '';
    rows.push(['effect size', `${e.name} = ${fmt(e.value)}${ci}  (${e.formula})`]);
  }
  if (r.variant) rows.push(['method', r.variant]);
  rows.push(['used', countsText(r)]);
  return rows;
}

function fmtInterval(ci: [number, number]): string {
  return `[${fmt(ci[0])}, ${fmt(ci[1])}]`;
}

function countsText(r: ResultBlock): string {
  const n = r.n;
  const parts: string[] = [];
  if (n.pairs !== undefined && n.first === undefined) parts.push(`${n.pairs} ${r.procedure === 'crossover-t' ? 'subjects' : 'pairs'}`);
  if (n.first !== undefined) parts.push(`${n.first} + ${n.second} values`);
  if (n.zeros) parts.push(`${n.zeros} zero ${n.zeros === 1 ? 'difference' : 'differences'}`);
  if (n.ties) parts.push(`${n.ties} tied ${n.ties === 1 ? 'group' : 'groups'}`);
  parts.push(`${n.dropped} dropped`);
  return parts.join(', ');
}

export const DIAGNOSTIC_HEADER = ['sample', 'n', 'mean', 'sd', 'median', 'quartiles', 'skewness', 'Shapiro-Wilk', 'outliers', 'zeros', 'tied'];

export function diagnosticRow(d: SampleDiagnostics): string[] {
  return [
    d.label,
    String(d.n),
    fmt(d.mean),
    fmt(d.sd),
    fmt(d.median),
    `${fmt(d.q1)} to ${fmt(d.q3)}`,
    d.skewness === null ? 'n/a' : fmt(d.skewness, 3),
    d.shapiro ? `W ${fmt(d.shapiro.w)}, p ${fmtP(d.shapiro.pValue)}` : 'n/a',
    String(d.outliers.count),
    String(d.zeros),
    String(d.tiedValues),
  ];
}

/** Wraps a paragraph at `width` columns, indenting every line. */
export function wrap(text: string, width = 92, indent = '  '): string {
  const out: string[] = [];
  let line = '';
  for (const word of text.split(/\s+/).filter(Boolean)) {
    if (line && (indent + line + ' ' + word).length > width) {
      out.push(indent + line);
      line = word;
    } else line = line ? `${line} ${word}` : word;
  }
  if (line) out.push(indent + line);
  return out.join('\n');
}
