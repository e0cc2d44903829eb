/**
 * A recommendation for people: terminal text (colour only through Style) and Markdown. Both are
 * built from one list of sections, so the two forms always say the same thing. Section names
 * and layout are tandem's own; a design outside a two-condition comparison leads with what to do
 * instead and shows no procedure.
 */
import type { Recommendation } from '../engine/types.js';
import { PROCEDURES, procedureName } from '../plan/procedures.js';
import type { Style } from './style.js';

export interface RenderOptions {
  /** The plan file written (or to be written) for this recommendation. */
  planPath?: string;
  /** The answers file read or saved. */
  answersPath?: string;
}

type Tone = 'plain' | 'warn' | 'bad';
interface Block {
  kind: 'para' | 'list' | 'commands' | 'hypotheses';
  lines: string[];
  /** hypotheses: [label, symbols, words] */
  rows?: [string, string, string][];
}
interface Section {
  title: string;
  tone: Tone;
  blocks: Block[];
}

const para = (...lines: string[]): Block => ({ kind: 'para', lines });
const list = (lines: string[]): Block => ({ kind: 'list', lines });
const commands = (lines: string[]): Block => ({ kind: 'commands', lines });

/** A path as typed in a POSIX shell: quoted when it holds anything but plain characters. */
export function shellQuote(s: string): string {
  return /^[A-Za-z0-9_./:=@%+-]+$/.test(s) ? s : `'${s.replace(/'/g, `'\\''`)}'`;
}

function answer(rec: Recommendation, id: string): string | undefined {
  const v = rec.answers[id];
  return v === undefined || String(v).trim() === '' ? undefined : String(v).trim();
}

/** The heading: the two conditions, the outcome and the unit, when the answers name them. */
export function headline(rec: Recommendation): string {
  const first = answer(rec, 'first_label');
  const second = answer(rec, 'second_label');
  const outcome = answer(rec, 'outcome');
  const unit = answer(rec, 'unit');
  const ou = answer(rec, 'outcome_unit');
  const what = outcome ? `${outcome}${ou ? ` (${ou})` : ''}${unit ? ` on each ${unit}` : ''}` : '';
  if (first && second) return `Recommendation: ${first} versus ${second}${what ? `, ${what}` : ''}`;
  return `Recommendation${what ? `: ${what}` : ''}`;
}

function alternativeWords(rec: Recommendation): string {
  const first = answer(rec, 'first_label') ?? 'the first condition';
  const unit = answer(rec, 'outcome_unit');
  const p = rec.procedure;
  if (p.margin !== undefined) {
    const binary = p.id !== null && PROCEDURES[p.id].binary;
    return `Aim: equivalence, the ${binary ? 'difference of proportions' : `mean difference`} lies between -${p.margin} and +${p.margin}${unit && !binary ? ` ${unit}` : ''}`;
  }
  if (p.alternative === 'greater') return `Alternative: one-sided, ${first} higher (the difference is above the null value)`;
  if (p.alternative === 'less') return `Alternative: one-sided, ${first} lower (the difference is below the null value)`;
  return 'Alternative: two-sided, a difference in either direction';
}

/** The sizing command, for the designs `tandem size` plans (paired and two-group t designs). */
function sizeStep(plan: string, rec: Recommendation): Block[] {
  const id = rec.procedure.id;
  if (id === null || PROCEDURES[id].binary || id === 'crossover-t') return [];
  const paired = PROCEDURES[id].family === 'paired';
  const sd = paired ? '--sd-diff S' : '--sd S';
  const what = PROCEDURES[id].equivalence ? 'D: the true difference you expect, often near 0' : 'D: the smallest difference worth detecting';
  const spread = paired ? 'S: the expected standard deviation of the differences' : 'S: the expected standard deviation within a group';
  return [para(`Before collecting data, size the study (${what}; ${spread}; both in the outcome unit):`), commands([`tandem size ${plan} --difference D ${sd}`])];
}

function nextSteps(rec: Recommendation, opts: RenderOptions): Block[] {
  if (rec.procedure.id === null) {
    return [para('tandem writes no plan for this design. If an answer was wrong, run tandem advise again; with an answers file, change that answer and run:'), commands([`tandem advise --answers ${shellQuote(opts.answersPath ?? 'answers.yaml')}`])];
  }
  const plan = shellQuote(opts.planPath ?? 'plan.yaml');
  const out: Block[] = [];
  if (!opts.planPath && opts.answersPath) {
    out.push(para('Write the plan file:'), commands([`tandem advise --answers ${shellQuote(opts.answersPath)} --plan plan.yaml`]));
  } else if (!opts.planPath) {
    out.push(para('Write the plan file, and keep the answers for later (the interview asks again):'), commands(['tandem advise --save-answers answers.yaml --plan plan.yaml']));
  }
  out.push(para(`Edit the data section of ${opts.planPath ?? 'the plan'} so that its column names match your CSV file, then check it:`), commands([`tandem plan check ${plan}`]));
  out.push(...sizeStep(plan, rec));
  out.push(para('Once the data are in, run the declared analysis:'), commands([`tandem analyze ${plan} --data YOUR_DATA.csv`]));
  return out;
}

/** The sections of a recommendation, in reading order. */
export function recommendationSections(rec: Recommendation, opts: RenderOptions = {}): Section[] {
  const s: Section[] = [];
  const d = rec.design;
  const p = rec.procedure;
  const other = d.family === 'other' || p.id === null;
  if (other) {
    s.push({ title: 'What to do instead', tone: 'bad', blocks: [para(`This is not a comparison of two conditions that tandem can analyse: ${d.label}.`), para(d.instead ?? 'Consult a statistician about a method for this design.')] });
  }
  const familyWords = d.family === 'paired' ? 'Paired' : d.family === 'independent' ? 'Independent groups' : 'Outside a two-condition comparison';
  s.push({ title: 'Design', tone: 'plain', blocks: [para(`${familyWords}: ${d.label} [${d.kind}]`)] });
  if (d.reasons.length) s.push({ title: 'Why', tone: 'plain', blocks: [list(d.reasons)] });
  if (!other && p.id !== null) {
    const procLines = [
      `${p.name} [${p.id}]`,
      ...(p.applies ? [`When it applies: ${p.applies}`] : []),
      `Estimate: ${p.estimate}`,
      alternativeWords(rec),
      `Confidence level of the interval: ${Number(((p.confidence ?? 0.95) * 100).toPrecision(6))}%`,
    ];
    const blocks = [para(...procLines)];
    if (p.notes?.length) blocks.push(list(p.notes));
    if (p.references?.length) blocks.push(para(`Sources: ${p.references.join('; ')}`));
    s.push({ title: 'Procedure', tone: 'plain', blocks });
    const sens = p.fallback
      ? [para(`${procedureName(p.fallback)} [${p.fallback}]`, ...(p.fallbackWhy ? [p.fallbackWhy] : [])), para('Fixed now and reported beside the main result whatever the data show; it is not a switch to make after looking at the data.')]
      : [para('None for this procedure.')];
    s.push({ title: 'Sensitivity analysis (declared now)', tone: 'plain', blocks: sens });
    s.push({ title: 'How n and df are counted', tone: 'plain', blocks: [para(p.nCounting, p.df)] });
    s.push({ title: 'Direction of subtraction', tone: 'plain', blocks: [para(rec.difference)] });
    const h = rec.hypotheses;
    // The symbols may carry their own "H0:" / "Ha:" prefix; the labels here are words.
    const rows: [string, string, string][] = [
      ['Null', h.nullSymbols, h.nullWords],
      ['Alternative', h.alternativeSymbols, h.alternativeWords],
    ];
    s.push({ title: 'Hypotheses', tone: 'plain', blocks: [{ kind: 'hypotheses', lines: [], rows }] });
  }
  if (rec.conditions.length) {
    s.push({ title: 'Conditions to check', tone: 'plain', blocks: [list(rec.conditions.map((c) => `${c.text.replace(/[.\s]+$/, '')}. How to check: ${c.check}${c.basis ? ` [${c.basis}]` : ''}`))] });
  }
  if (!other) {
    s.push({
      title: 'What the conclusion may claim',
      tone: 'plain',
      blocks: [
        list([
          `Cause and effect: ${rec.scope.causal ? 'yes, the conditions were assigned at random' : 'no, the conditions were not assigned at random; report an association'}`,
          `Beyond the units studied: ${rec.scope.generalize ? 'yes, to the population they were sampled from at random' : 'no, the units were not a random sample; the result describes these units'}`,
        ]),
        ...(rec.scope.text ? [para(rec.scope.text)] : []),
      ],
    });
  }
  if (rec.warnings.length) s.push({ title: 'Warnings', tone: 'warn', blocks: [list(rec.warnings)] });
  if (rec.cautions.length) s.push({ title: 'Cautions', tone: 'warn', blocks: [list(rec.cautions)] });
  s.push({ title: 'Next steps', tone: 'plain', blocks: nextSteps(rec, opts) });
  return s;
}

const WIDTH = 92;

/** Word-wraps one line to WIDTH with `first` before it and `rest` before its continuations. */
function wrap(text: string, first: string, rest: string): string[] {
  const words = text.split(/\s+/).filter(Boolean);
  const out: string[] = [];
  let line = first;
  let fresh = true;
  for (const w of words) {
    if (!fresh && line.length + 1 + w.length > WIDTH) {
      out.push(line);
      line = rest + w;
    } else line += (fresh ? '' : ' ') + w;
    fresh = false;
  }
  out.push(line);
  return out;
}

/** Terminal text; with a plain Style the bytes are the same with or without a terminal. */
export function renderRecommendationText(rec: Recommendation, style: Style, opts: RenderOptions = {}): string {
  const out: string[] = [style.bold(headline(rec)), ''];
  for (const sec of recommendationSections(rec, opts)) {
    const tone = sec.tone === 'bad' ? style.bad : sec.tone === 'warn' ? style.warn : style.accent;
    out.push(style.bold(tone(sec.title.toUpperCase())));
    for (const b of sec.blocks) {
      for (const [label, symbols, words] of b.rows ?? []) {
        out.push(`  ${`${label}:`.padEnd(13)}${symbols}`);
        out.push(...wrap(words, '               ', '               '));
      }
      for (const l of b.lines) {
        if (b.kind === 'list') out.push(...wrap(l, '  - ', '    '));
        else if (b.kind === 'commands') out.push('    ' + style.accent(l));
        else out.push(...wrap(l, '  ', '  '));
      }
    }
    out.push('');
  }
  return out.join('\n');
}

/** Markdown text with Markdown's own characters escaped (so a label with * or _ stays literal). */
export function escapeMarkdown(s: string): string {
  return s.replace(/([\\`*_[\]<>#|])/g, '\\$1');
}

function code(s: string): string {
  return s.includes('`') ? `\`\` ${s} \`\`` : `\`${s}\``;
}

/** Markdown for a review or a lab notebook; hypotheses in code spans, commands in a shell block. */
export function renderRecommendationMarkdown(rec: Recommendation, opts: RenderOptions = {}): string {
  const out: string[] = [`# ${escapeMarkdown(headline(rec))}`, ''];
  for (const sec of recommendationSections(rec, opts)) {
    out.push(`## ${sec.title}`, '');
    for (const b of sec.blocks) {
      if (b.kind === 'commands') out.push('```sh', ...b.lines, '```');
      else if (b.kind === 'hypotheses') out.push(...(b.rows ?? []).map(([label, symbols, words]) => `- ${label}: ${code(symbols)}  \n  ${escapeMarkdown(words)}`));
      else if (b.kind === 'list') out.push(...b.lines.map((l) => `- ${escapeMarkdown(l)}`));
      else if (sec.tone === 'bad') out.push(b.lines.map((l) => `> **${escapeMarkdown(l)}**`).join('\n>\n'));
      else out.push(b.lines.map(escapeMarkdown).join('  \n'));
      out.push('');
    }
  }
  return out.join('\n');
}
