/**
 * The interactive interview: asks the rule base's questions one at a time through a prompt
 * adapter (inquirer by default, loaded only here), lets the user go back and change an earlier
 * answer, and returns the answers on the final question path.
 *
 * Going back: every select list has "< Back to the previous question", and typing `<` in a
 * number or text prompt does the same. The earlier question is asked again with its answer
 * highlighted; after any change `next` is walked again from the start, so answers to questions
 * that no longer apply are dropped, and questions that still apply are asked again with the
 * earlier answer as the suggestion (Enter keeps it). Initial answers (from an answers file) are
 * kept and never asked, and returned even when they do not apply (so the caller can say so);
 * going back stops at the first question asked in this session.
 *
 * Help: the first sentence of a question's help is shown dim under it; "? Explain this question"
 * (or typing `?`) shows the whole explanation and an example of each answer, then asks again.
 *
 * Ctrl-C raises CancelledError: the caller exits 130 and writes nothing.
 */
import type { IO } from '../cli/io.js';
import type { AnswerValue, Answers, Question } from '../engine/types.js';
import { toCancelled, type PromptAdapter, type SelectItem } from './adapter.js';
import { describeAllowed, parseTyped } from './check-value.js';
import { walk, type NextQuestion } from './walk.js';

/** Typed in a number or text prompt: go back to the previous question. */
export const BACK_KEYWORD = '<';
/** Typed in a number or text prompt: show the full explanation. */
export const HELP_KEYWORD = '?';
/** Select values of the two navigation entries; rule-base values never start with a control character. */
export const BACK_VALUE = '\u0001back';
export const HELP_VALUE = '\u0001help';

export interface InterviewOptions {
  next: NextQuestion;
  initial?: Answers;
  io: IO;
  /** Defaults to the inquirer adapter on io.stdin / io.stdout. */
  ask?: PromptAdapter;
}

type Step = { kind: 'answer'; value: AnswerValue } | { kind: 'back' };

export async function runInterview(opts: InterviewOptions): Promise<Answers> {
  const fixed: Answers = { ...(opts.initial ?? {}) };
  /** Answers typed in this session, remembered as suggestions even when they left the path. */
  const given: Answers = {};
  /** Session answers the user has confirmed on the way to the current question. */
  const confirmed = new Set<string>();
  const has = (o: Answers, id: string): boolean => Object.prototype.hasOwnProperty.call(o, id);
  try {
    // inquirer is loaded only once a question must actually be asked.
    let ask = opts.ask;
    for (;;) {
      const w = walk(opts.next, (id) => (has(fixed, id) ? fixed[id] : confirmed.has(id) ? given[id] : undefined));
      const asked = w.order.filter((id) => confirmed.has(id));
      // Confirmations that fell off the path no longer count; the value stays as a suggestion.
      for (const id of [...confirmed]) if (!asked.includes(id)) confirmed.delete(id);
      if (w.pending === null) return withInitial(w.used, fixed);
      const q = w.pending;
      ask ??= await (await import('./inquirer-adapter.js')).inquirerAdapter(opts.io);
      const step = await askQuestion(ask, q, { number: asked.length + 1, canGoBack: asked.length > 0, previous: has(given, q.id) ? given[q.id] : undefined });
      if (step.kind === 'back') {
        confirmed.delete(asked[asked.length - 1]);
        continue;
      }
      given[q.id] = step.value;
      confirmed.add(q.id);
    }
  } catch (err) {
    throw toCancelled(err);
  }
}

/**
 * The answers on the path, then any initial answers off the path: those are kept as given (the
 * caller may say they do not apply), while session answers that no longer apply are dropped.
 */
function withInitial(used: Answers, fixed: Answers): Answers {
  const out: Answers = { ...used };
  for (const [id, v] of Object.entries(fixed)) if (!Object.prototype.hasOwnProperty.call(out, id)) out[id] = v;
  return out;
}

interface AskContext {
  /** Position among the questions asked in this session ("(question 4)"). */
  number: number;
  canGoBack: boolean;
  previous?: AnswerValue;
}

/** Asks one question until it gets an answer or a request to go back; help requests loop here. */
export async function askQuestion(ask: PromptAdapter, q: Question, ctx: AskContext): Promise<Step> {
  const message = `(question ${ctx.number}) ${q.text}`;
  const help = firstSentence(q.help);
  const previous = ctx.previous;
  for (;;) {
    if (q.type === 'choice') {
      const choices = q.choices ?? [];
      if (choices.length === 0) throw new Error(`question '${q.id}' has no choices`);
      const items: SelectItem[] = choices.map((c) => ({ value: c.value, name: c.label, description: c.help }));
      const keys: [string, string][] = [];
      items.push({ separator: true });
      if (ctx.canGoBack) {
        items.push({ value: BACK_VALUE, name: '< Back to the previous question', description: 'Change an earlier answer; answers that no longer apply are dropped.' });
        keys.push(['<', 'back']);
      }
      items.push({ value: HELP_VALUE, name: '? Explain this question', description: 'Show the whole explanation with an example of each answer.' });
      keys.push(['?', 'explain']);
      const def = typeof previous === 'string' && choices.some((c) => c.value === previous) ? previous : undefined;
      const v = await ask.select({ message, help, choices: items, default: def, keys });
      if (v === BACK_VALUE) return { kind: 'back' };
      if (v === HELP_VALUE) {
        ask.say(explain(q));
        continue;
      }
      return { kind: 'answer', value: v };
    }
    const hint = inputHint(q, ctx.canGoBack);
    const typed = await ask.input({
      message,
      help,
      hint,
      default: previous === undefined || previous === '' ? undefined : String(previous),
      shown: (s) => {
        const t = s.trim();
        return t === '' ? '(left blank)' : t === BACK_KEYWORD ? '(back)' : t === HELP_KEYWORD ? '(explain)' : t;
      },
      validate: (s) => {
        const t = s.trim();
        if (t === HELP_KEYWORD) return true;
        if (t === BACK_KEYWORD) return ctx.canGoBack ? true : 'This is the first question; there is nothing to go back to.';
        const r = parseTyped(q, s);
        return r.ok ? true : r.message;
      },
    });
    const t = typed.trim();
    if (t === BACK_KEYWORD) {
      if (ctx.canGoBack) return { kind: 'back' };
      continue;
    }
    if (t === HELP_KEYWORD) {
      ask.say(explain(q));
      continue;
    }
    const r = parseTyped(q, typed);
    if (r.ok) return { kind: 'answer', value: r.value };
    // An adapter that skipped validation: ask again rather than accept a bad value.
  }
}

function inputHint(q: Question, canGoBack: boolean): string {
  const allowed = describeAllowed(q);
  const what = allowed.charAt(0).toUpperCase() + allowed.slice(1);
  const blank = q.optional ? ', or blank to skip' : '';
  const keys = canGoBack ? `${HELP_KEYWORD} explains, ${BACK_KEYWORD} goes back` : `${HELP_KEYWORD} explains`;
  return `${what.replace(/, or blank$/, '')}${blank}. (${keys})`;
}

/** The first sentence of a help text, for the dim line under the question. */
export function firstSentence(text: string): string {
  const flat = text.replace(/\s+/g, ' ').trim();
  const end = /[.!?](?=\s|$)/g;
  for (let m = end.exec(flat); m; m = end.exec(flat)) {
    const head = flat.slice(0, m.index + 1);
    // "e.g." and "i.e." end no sentence (and neither do "etc." or "vs." inside one).
    if (/(^|[\s(])(e\.g|i\.e|etc|vs|cf|approx)\.$/i.test(head)) continue;
    return head;
  }
  return flat;
}

/** The whole explanation of a question: its help and, for choices, each answer with its example. */
export function explain(q: Question): string {
  const lines = ['', ...wrapIndent(q.help.trim(), '  ')];
  if (q.type === 'choice' && q.choices?.length) {
    lines.push('', '  The answers:');
    for (const c of q.choices) lines.push(`  - ${c.label}: ${c.help.replace(/\s+/g, ' ').trim()}`);
  } else {
    lines.push('', `  Allowed: ${describeAllowed(q)}.`);
  }
  lines.push('');
  return lines.join('\n') + '\n';
}

function wrapIndent(text: string, indent: string): string[] {
  return text.split(/\r?\n/).map((l) => (l.trim() === '' ? '' : indent + l.trim()));
}
