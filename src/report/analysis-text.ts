/**
 * The analysis as terminal text. Sections, in reading order: what was compared, the result, the
 * sensitivity analysis, the checks on the data (with the plot), how the data were handled, the
 * conclusion, cautions. Colour comes only from the Style (off with NO_COLOR or when not a
 * terminal), so the same report piped to a file is plain text.
 */
import { plotStrips } from './plot.js';
import { textTable, type Style } from './style.js';
import { percent } from './analysis-conclusion.js';
import { DIAGNOSTIC_HEADER, diagnosticRow, resultRows, wordsOf, wrap } from './analysis-parts.js';
import type { AnalysisReport, ResultBlock } from './analysis-types.js';

export function analysisText(a: AnalysisReport, style: Style): string {
  const out: string[] = [];
  const section = (name: string): void => {
    out.push('', style.bold(name));
  };
  const bullet = (s: string, mark = '-'): string => wrap(`${mark} ${s}`, 92, '  ').replace(/^ {2}/, '  ').replace(/\n {2}/g, '\n    ');

  out.push(style.bold(a.title));
  out.push(style.dim(`${a.mode === 'plan' ? `plan ${a.plan}` : 'quick mode (no plan)'}; data ${a.data.file}: ${a.data.rows} rows, layout ${a.data.layout}`));

  section('What was compared');
  const p = a.main;
  const rows: string[][] = [
    ['direction', a.difference],
    ['outcome', outcomeWords(a)],
    ['procedure', `${p.name} [${p.procedure}], ${p.alternative}, ${percent(p.confidence)} interval${p.margin !== undefined ? `, margin ${p.margin}` : ''}`],
    ['sensitivity', a.sensitivity ? `${a.sensitivity.name} [${a.sensitivity.procedure}]${a.sensitivity.why ? `: ${a.sensitivity.why}` : ''}` : 'none declared'],
  ];
  out.push(textTable(rows, { indent: '  ' }));

  section(`Result: ${p.name}`);
  out.push(resultTable(p, a, style));
  out.push(wrap(capital(p.reading) + '.', 92, '  '));

  if (a.sensitivity) {
    section(`Sensitivity analysis: ${a.sensitivity.name}`);
    out.push(resultTable(a.sensitivity, a, style));
    out.push(wrap(capital(a.sensitivity.reading) + '.', 92, '  '));
    if (a.agreement) out.push(wrap(a.agreement, 92, '  '));
  }

  section('Checks on the data');
  if (a.diagnostics.length) out.push(textTable([DIAGNOSTIC_HEADER, ...a.diagnostics.map(diagnosticRow)], { indent: '  ', right: [1, 2, 3, 4, 6, 8, 9, 10] }));
  if (a.diagnosticsNote) out.push(wrap(a.diagnosticsNote, 92, '  '));
  for (const d of a.diagnostics.filter((x) => x.shapiroNote)) out.push(bullet(`${d.label}: ${d.shapiroNote}`));
  for (const f of a.flags) {
    const mark = f.severity === 'contradiction' ? style.warn('!') : '-';
    out.push(bullet(`${f.sample}: ${f.text}`, mark));
  }
  if (a.flagSummary) out.push(wrap(a.flagSummary, 92, '  '));
  else if (a.diagnostics.length) out.push('  No diagnostic contradicts a condition of the declared procedure.');
  if (a.plot.strips.length) {
    out.push('');
    out.push(plotStrips(a.plot.strips, { reference: a.plot.reference, legend: a.plot.legend, width: 64 }).replace(/^/gm, '  '));
  }

  section('Data handling');
  out.push(`  read ${a.data.file} with the ${a.data.parser === 'fast' ? 'plain scan' : 'quoted-CSV parser'}; missing markers: ${a.data.missingMarkers.map((m) => (m === '' ? 'empty cell' : m)).join(', ')}`);
  for (const n of a.data.notes) out.push(bullet(n));
  for (const x of a.data.warnings) out.push(bullet(style.warn(x), style.warn('!')));

  if (a.planWarnings.length) {
    section('Warnings from the plan');
    for (const x of a.planWarnings) out.push(bullet(style.warn(x), style.warn('!')));
  }

  section('Conclusion');
  out.push(wrap(a.conclusion, 92, '  '));

  if (a.cautions.length) {
    section('Cautions');
    for (const c of a.cautions) out.push(bullet(c));
  }
  return out.join('\n') + '\n';
}

function resultTable(r: ResultBlock, a: AnalysisReport, style: Style): string {
  const rows = resultRows(r, wordsOf(a)).map(([k, v]) => [k, k === 'result' ? style.bad(v) : v]);
  const notes = r.notes.map((n) => ['note', n]);
  return textTable([...rows, ...notes], { indent: '  ' });
}

function outcomeWords(a: AnalysisReport): string {
  const o = a.outcome;
  const parts = [o.name ?? 'not named', o.unit ? `in ${o.unit}` : '', o.binary ? `binary, the event is '${o.event ?? '1, yes or true'}'` : ''];
  return parts.filter(Boolean).join(', ');
}

function capital(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}
