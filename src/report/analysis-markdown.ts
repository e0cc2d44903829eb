/**
 * The analysis as Markdown (`--report FILE.md`), for pasting into a review: the same sections and
 * numbers as the terminal text, with tables and the plot in a code block.
 */
import { plotStrips } from './plot.js';
import { markdownTable } from './style.js';
import { percent } from './analysis-conclusion.js';
import { DIAGNOSTIC_HEADER, diagnosticRow, resultRows, wordsOf } from './analysis-parts.js';
import type { AnalysisReport, ResultBlock } from './analysis-types.js';

export function analysisMarkdown(a: AnalysisReport): string {
  const out: string[] = [];
  const p = a.main;
  out.push(`# ${a.title}`, '');
  out.push(`_${a.tool}; ${a.mode === 'plan' ? `plan \`${a.plan}\`` : 'quick mode (no plan)'}; data \`${a.data.file}\` (${a.data.rows} rows, layout ${a.data.layout})_`, '');

  out.push('## What was compared', '');
  out.push(`- **Direction:** ${a.difference}`);
  if (a.outcome.name || a.outcome.unit) out.push(`- **Outcome:** ${[a.outcome.name, a.outcome.unit ? `(${a.outcome.unit})` : ''].filter(Boolean).join(' ')}`);
  out.push(`- **Procedure:** ${p.name} (\`${p.procedure}\`), ${p.alternative}, ${percent(p.confidence)} interval${p.margin !== undefined ? `, margin ${p.margin}` : ''}`);
  out.push(`- **Sensitivity analysis (declared in advance):** ${a.sensitivity ? `${a.sensitivity.name} (\`${a.sensitivity.procedure}\`)${a.sensitivity.why ? `: ${a.sensitivity.why}` : ''}` : 'none'}`, '');

  out.push(`## Result: ${p.name}`, '', resultTable(p, a), '', `${capital(p.reading)}.`, '');
  if (a.sensitivity) {
    out.push(`## Sensitivity analysis: ${a.sensitivity.name}`, '', resultTable(a.sensitivity, a), '', `${capital(a.sensitivity.reading)}.`, '');
    if (a.agreement) out.push(a.agreement, '');
  }

  out.push('## Checks on the data', '');
  if (a.diagnostics.length) out.push(markdownTable(DIAGNOSTIC_HEADER, a.diagnostics.map(diagnosticRow), [1, 2, 3, 4, 6, 8, 9, 10]), '');
  if (a.diagnosticsNote) out.push(a.diagnosticsNote, '');
  for (const d of a.diagnostics.filter((x) => x.shapiroNote)) out.push(`- ${d.label}: ${d.shapiroNote}`);
  for (const f of a.flags) out.push(`- ${f.severity === 'contradiction' ? '**Condition in doubt:** ' : ''}${f.sample}: ${f.text}`);
  if (a.flags.length) out.push('');
  if (a.flagSummary) out.push(a.flagSummary, '');
  else if (a.diagnostics.length) out.push('No diagnostic contradicts a condition of the declared procedure.', '');
  if (a.plot.strips.length) out.push('```', plotStrips(a.plot.strips, { reference: a.plot.reference, legend: a.plot.legend, width: 64 }), '```', '');

  out.push('## Data handling', '');
  out.push(`- read with the ${a.data.parser === 'fast' ? 'plain scan' : 'quoted-CSV parser'}; missing markers: ${a.data.missingMarkers.map((m) => (m === '' ? 'empty cell' : `\`${m}\``)).join(', ')}`);
  for (const n of a.data.notes) out.push(`- ${n}`);
  for (const x of a.data.warnings) out.push(`- **Warning:** ${x}`);
  out.push('');
  if (a.planWarnings.length) {
    out.push('## Warnings from the plan', '');
    for (const x of a.planWarnings) out.push(`- ${x}`);
    out.push('');
  }

  out.push('## Conclusion', '', a.conclusion, '');
  if (a.cautions.length) {
    out.push('## Cautions', '');
    for (const c of a.cautions) out.push(`- ${c}`);
    out.push('');
  }
  return out.join('\n');
}

function resultTable(r: ResultBlock, a: AnalysisReport): string {
  const rows = [...resultRows(r, wordsOf(a)), ...r.notes.map((n): [string, string] => ['note', n])];
  return markdownTable(['', r.procedure], rows.map(([k, v]) => [k, v]));
}

function capital(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}
