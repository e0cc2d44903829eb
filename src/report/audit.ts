/**
 * The audit for people and programs: terminal text (colour only through Style), a Markdown review
 * that can be sent to the colleague as it is, and JSON. Text and Markdown are built from one list
 * of sections so they always say the same thing. Section names are tandem's own.
 */
import { FINDING_CODES } from '../audit/codes.js';
import { showRange } from '../audit/digits.js';
import { PROCEDURE_LABEL } from '../audit/procedure-names.js';
import type { AuditResult, Claim, Finding, ReportedNumber } from '../audit/types.js';
import type { TestResult } from '../stats/types.js';
import { VERSION } from '../version.js';
import { fmt, fmtP, markdownTable, textTable, type Style } from './style.js';

type Block = { kind: 'para'; text: string } | { kind: 'list'; items: string[] } | { kind: 'table'; header: string[]; rows: string[][]; right?: number[] } | { kind: 'findings'; items: Finding[] };
interface Section {
  title: string;
  blocks: Block[];
}

export function counts(r: AuditResult): { errors: number; warnings: number; notes: number } {
  const n = (s: string): number => r.findings.filter((f) => f.severity === s).length;
  return { errors: n('error'), warnings: n('warning'), notes: n('note') };
}

function plural(n: number, word: string): string {
  return `${n} ${word}${n === 1 ? '' : 's'}`;
}

function verdict(r: AuditResult): string {
  const c = counts(r);
  const tally = `${plural(c.errors, 'error')}, ${plural(c.warnings, 'warning')}, ${plural(c.notes, 'note')}`;
  if (c.errors) return `${tally}. The reported analysis cannot stand as written: see the errors below, each with what to do.`;
  if (c.warnings) return `${tally}. No error was found; the warnings point at weaknesses a reader should know about.`;
  return `${tally}. The reported analysis is consistent with the study facts and with itself, as far as the record lets tandem check.`;
}

const CLAIM_WORDS: Record<Claim, (a: string, b: string) => string> = {
  difference: () => 'the conditions differ',
  'no-difference': () => 'no difference',
  equivalent: () => 'equivalent',
  'not-equivalent': () => 'not shown equivalent',
  'first-higher': (a) => `${a} higher`,
  'second-higher': (_a, b) => `${b} higher`,
  inconclusive: () => 'inconclusive',
};

const rn = (x?: ReportedNumber): string | undefined => x?.text;

function reportedRows(r: AuditResult): string[][] {
  const p = r.record.reported;
  const rows: [string, string | undefined][] = [
    ['procedure', p.procedureText && (p.procedure && p.procedureText !== p.procedure ? `${p.procedureText} (read as: ${PROCEDURE_LABEL[p.procedure]})` : p.procedure ? PROCEDURE_LABEL[p.procedure] : p.procedureText)],
    ['difference', p.difference && `${p.difference.first} minus ${p.difference.second}`],
    ['alternative', p.alternative],
    ['chosen after a pre-test', p.pretest && p.pretest !== 'none' ? p.pretest : undefined],
    ['pairing', p.pairing],
    ['tests on the same units', p.comparisons !== undefined ? String(p.comparisons) : undefined],
    ['n', rn(p.n)],
    ['n1, n2', p.n1 || p.n2 ? `${rn(p.n1) ?? '?'}, ${rn(p.n2) ?? '?'}` : undefined],
    ['df', rn(p.df)],
    ['statistic', p.statistic && `${p.statisticName ? `${p.statisticName} = ` : ''}${p.statistic.text}`],
    ['p-value', rn(p.pValue)],
    ['estimate', rn(p.estimate)],
    ['standard error', rn(p.se)],
    ['SD of differences', rn(p.sd)],
    ['interval', p.ci && `${rn(p.ci.lower) ?? '-infinity'} to ${rn(p.ci.upper) ?? 'infinity'}${p.confidence ? ` (${Math.round(p.confidence * 1000) / 10}%)` : ''}`],
    ['effect size', p.effectSize && `${p.effectSize.name ?? ''} ${rn(p.effectSize.value) ?? ''} (formula: ${p.effectSize.formula}${p.effectSize.formulaStated ? ', stated' : ', not stated in the report'})`.trim()],
    ['equivalence', p.equivalence && [p.equivalence.margin && `margin ±${p.equivalence.margin.text}`, p.equivalence.pLower && `p lower ${p.equivalence.pLower.text}`, p.equivalence.pUpper && `p upper ${p.equivalence.pUpper.text}`, p.equivalence.decisionP && `decided on p ${p.equivalence.decisionP.text}`, p.equivalence.decision].filter(Boolean).join(', ')],
    ['conclusion', p.claim && CLAIM_WORDS[p.claim](p.difference?.first ?? 'the first condition', p.difference?.second ?? 'the second condition')],
  ];
  for (const [i, g] of (p.groups ?? []).entries()) {
    rows.push([`group ${g.label ?? i + 1}`, [g.n && `n ${g.n.text}`, g.mean && `mean ${g.mean.text}`, g.sd && `SD ${g.sd.text}`].filter(Boolean).join(', ')]);
  }
  return rows.filter((x): x is [string, string] => x[1] !== undefined && x[1] !== '');
}

function studySection(r: AuditResult): Section {
  const rec = r.recommendation;
  const blocks: Block[] = [];
  if (r.record.story) blocks.push({ kind: 'para', text: r.record.story });
  if (rec) {
    blocks.push({ kind: 'para', text: `Design: ${rec.design.label} (${rec.design.family}).${r.record.answersFrom && r.record.answersFrom !== 'the record' ? ` Study facts from ${r.record.answersFrom}.` : ''}` });
    if (rec.design.reasons.length) blocks.push({ kind: 'list', items: rec.design.reasons });
    if (rec.procedure.id) blocks.push({ kind: 'para', text: `Recommended procedure: ${PROCEDURE_LABEL[rec.procedure.id]}${rec.procedure.fallback ? `, with the ${PROCEDURE_LABEL[rec.procedure.fallback]} pre-declared as a sensitivity analysis` : ''}. ${rec.procedure.nCounting ? `${rec.procedure.nCounting}. ` : ''}${rec.procedure.df ? `${rec.procedure.df}.` : ''}`.trim() });
    else if (rec.design.instead) blocks.push({ kind: 'para', text: `Instead of a two-condition procedure: ${rec.design.instead}` });
    if (rec.difference) blocks.push({ kind: 'para', text: `Direction: ${rec.difference}.`.replace(/\.\.$/, '.') });
  } else if (r.record.statedDesign) {
    blocks.push({ kind: 'para', text: `Design as stated by the reviewer: ${r.record.statedDesign.family}${r.record.statedDesign.kind ? ` (${r.record.statedDesign.kind})` : ''}.` });
  }
  if (r.recommendationNote) blocks.push({ kind: 'para', text: `Note: ${r.recommendationNote}.` });
  return { title: 'The study as described', blocks };
}

function checksSection(r: AuditResult): Section | undefined {
  if (!r.checks.length) return undefined;
  const rows = r.checks.map((c) => [c.what, c.reported, c.expected ? showRange(c.expected, 4) : '-', c.ok === null ? (c.note ?? 'not checked') : c.ok ? 'consistent' : 'OFF']);
  return { title: 'Numbers rechecked', blocks: [{ kind: 'para', text: 'Each reported number against the value the other reported numbers imply, allowing for rounding: half a unit in the last written digit of every number involved.' }, { kind: 'table', header: ['what', 'reported', 'consistent values', 'verdict'], rows }] };
}

function resultCells(t: TestResult | null, why?: string): string[] {
  if (!t) return [why ?? 'not computed', '', '', '', '', '', ''];
  const n = t.n.pairs !== undefined ? `${t.n.pairs} pairs` : `${t.n.first ?? '?'} + ${t.n.second ?? '?'}`;
  return [
    `${fmt(t.estimate)} (${t.estimateName})`,
    `${fmt(t.ci[0])} to ${fmt(t.ci[1])} (${Math.round(t.confidence * 1000) / 10}%)`,
    `${t.statisticName} = ${fmt(t.statistic)}`,
    t.df === null ? '-' : fmt(t.df),
    `${fmtP(t.pValue)} (${t.alternative})`,
    n,
    t.effectSize ? `${t.effectSize.name} = ${fmt(t.effectSize.value, 3)}` : '-',
  ];
}

function dataSection(r: AuditResult): Section | undefined {
  const d = r.data;
  if (!d) return undefined;
  const labels = ['estimate', 'interval', 'statistic', 'df', 'p-value', 'n', 'effect size'];
  const a = resultCells(d.colleague.result, d.colleague.why);
  const b = d.recommended ? resultCells(d.recommended.result, d.recommended.why) : undefined;
  const rows = labels.map((l, i) => (b ? [l, a[i], b[i]] : [l, a[i]]));
  const header = b ? ['', `as the colleague ran it: ${d.colleague.label}`, `as recommended: ${d.recommended!.label}`] : ['', `as the colleague ran it: ${d.colleague.label}`];
  const notes = [...(d.colleague.result?.notes ?? []), ...(d.recommended?.result?.notes ?? [])];
  const blocks: Block[] = [{ kind: 'para', text: `Recomputed from ${d.file}. How the data were read:` }, { kind: 'list', items: d.pairing }, { kind: 'table', header, rows }];
  if (notes.length) blocks.push({ kind: 'list', items: [...new Set(notes)] });
  return { title: 'Side by side on the data', blocks };
}

function sections(r: AuditResult): Section[] {
  const out: Section[] = [{ title: 'Verdict', blocks: [{ kind: 'para', text: verdict(r) }] }, studySection(r), { title: 'What was reported', blocks: [{ kind: 'table', header: ['item', 'as written'], rows: reportedRows(r) }] }];
  out.push({ title: 'Findings', blocks: r.findings.length ? [{ kind: 'findings', items: r.findings }] : [{ kind: 'para', text: 'None.' }] });
  const c = checksSection(r);
  if (c) out.push(c);
  const d = dataSection(r);
  if (d) out.push(d);
  const cautions = r.recommendation?.cautions ?? [];
  const limits = 'tandem checks the design against the procedure and the reported numbers against each other (and against the data when given). It cannot see how the data were collected beyond what the record states.';
  const duty = " It does not replace a qualified statistician, an ethics review or a protocol's pre-specified analysis plan.";
  out.push({ title: 'Limits of this review', blocks: [{ kind: 'para', text: cautions.length ? limits : limits + duty }, ...(cautions.length ? [{ kind: 'list' as const, items: cautions }] : [])] });
  return out;
}

const TAG: Record<Finding['severity'], string> = { error: 'ERROR', warning: 'WARNING', note: 'NOTE' };

export function renderAuditText(r: AuditResult, s: Style): string {
  const lines: string[] = [s.bold(`Review of the reported analysis: ${r.record.title}`), ''];
  for (const sec of sections(r)) {
    lines.push(s.bold(sec.title));
    for (const b of sec.blocks) {
      if (b.kind === 'para') lines.push(`  ${b.text}`);
      else if (b.kind === 'list') for (const i of b.items) lines.push(`  - ${i}`);
      else if (b.kind === 'table') lines.push(textTable([b.header, ...b.rows], { indent: '  ' }));
      else {
        for (const f of b.items) {
          const paint = f.severity === 'error' ? s.bad : f.severity === 'warning' ? s.warn : s.dim;
          lines.push(`  ${paint(TAG[f.severity])} ${s.accent(f.code)}`);
          lines.push(`    ${f.message}`);
          lines.push(`    ${s.good('What to do:')} ${f.fix}`);
        }
      }
    }
    lines.push('');
  }
  return lines.join('\n');
}

export function renderAuditMarkdown(r: AuditResult): string {
  const out: string[] = [`# Review of the reported analysis: ${r.record.title}`, '', `_Prepared with tandem ${VERSION} from the audit record ${r.record.file}._`, ''];
  for (const sec of sections(r)) {
    out.push(`## ${sec.title}`, '');
    for (const b of sec.blocks) {
      if (b.kind === 'para') out.push(b.text, '');
      else if (b.kind === 'list') out.push(...b.items.map((i) => `- ${i}`), '');
      else if (b.kind === 'table') out.push(markdownTable(b.header, b.rows, b.right), '');
      else {
        b.items.forEach((f, i) => {
          out.push(`### ${i + 1}. ${TAG[f.severity].toLowerCase()}: ${FINDING_CODES[f.code].doc}`, '', `Code \`${f.code}\`.`, '', f.message, '', `**What to do:** ${f.fix}`, '');
        });
      }
    }
  }
  return out.join('\n').replace(/\n{3,}/g, '\n\n');
}

/** The JSON form: `findings` each with code, severity, message, fix (and recomputed values). */
export function auditJson(r: AuditResult, exitCode: number): object {
  return {
    format: 'tandem-audit-result/1',
    tandem: VERSION,
    record: { file: r.record.file, title: r.record.title },
    summary: { ...counts(r), exit: exitCode },
    design: r.recommendation ? { family: r.recommendation.design.family, kind: r.recommendation.design.kind, label: r.recommendation.design.label, reasons: r.recommendation.design.reasons } : r.record.statedDesign ?? null,
    recommended: r.recommendation ? { procedure: r.recommendation.procedure.id, fallback: r.recommendation.procedure.fallback, alternative: r.recommendation.procedure.alternative, difference: r.recommendation.difference } : null,
    note: r.recommendationNote ?? null,
    findings: r.findings.map((f) => ({ code: f.code, severity: f.severity, message: f.message, fix: f.fix, ...(f.values ? { values: f.values } : {}) })),
    checks: r.checks,
    data: r.data ?? null,
    cautions: r.recommendation?.cautions ?? [],
  };
}
