/**
 * The prompt adapter built on inquirer (v14): its `createPromptModule` takes the input and
 * output streams, so the same code runs on a terminal and in tests that type keys into a
 * PassThrough and read what was drawn. Only what the `inquirer` package itself exposes is used
 * (createPromptModule, Separator); inquirer is imported dynamically, so commands that never ask
 * anything do not load it.
 *
 * Colours come from src/report/style.ts (the one place that colours): inquirer's own theme is
 * replaced, so with colour off (NO_COLOR, tests) the screen holds plain text only.
 */
import { Writable } from 'node:stream';
import type { IO } from '../cli/io.js';
import { CancelledError } from '../errors.js';
import { makeStyle, type Style } from '../report/style.js';
import { toCancelled, type ConfirmPrompt, type InputPrompt, type PromptAdapter, type SelectPrompt } from './adapter.js';

type Status = string;
type QuestionConfig = Record<string, unknown>;
type PromptModule = (questions: QuestionConfig[]) => Promise<Record<string, unknown>>;

export async function inquirerAdapter(io: IO): Promise<PromptAdapter> {
  const { default: inquirer } = await import('inquirer');
  const style = makeStyle(io.color);

  async function prompt<T>(question: QuestionConfig): Promise<T> {
    // Input that ends (a closed pipe, end of a test script) cancels instead of waiting forever.
    const controller = new AbortController();
    const stdin = io.stdin as NodeJS.ReadableStream & { readableEnded?: boolean };
    const onEnd = (): void => controller.abort(new CancelledError('the input ended before the interview was finished: nothing was written'));
    if (stdin.readableEnded) onEnd();
    else stdin.once('end', onEnd);
    try {
      const module = inquirer.createPromptModule({ input: io.stdin, output: outputFor(io), signal: controller.signal }) as unknown as PromptModule;
      const answers = await module([{ ...question, name: 'value' }]);
      return answers.value as T;
    } catch (err) {
      throw toCancelled(err);
    } finally {
      stdin.removeListener('end', onEnd);
    }
  }

  return {
    select: (p: SelectPrompt) =>
      prompt<string>({
        type: 'select',
        message: p.message,
        choices: p.choices.map((c) => ('separator' in c ? new inquirer.Separator() : { value: c.value, name: c.name, description: c.description })),
        ...(p.default !== undefined ? { default: p.default } : {}),
        pageSize: Math.min(Math.max(7, p.choices.length), 15),
        loop: false,
        theme: theme(style, withHelp(style, p.help), p.keys ?? []),
      }),
    input: (p: InputPrompt) =>
      prompt<string>({
        type: 'input',
        message: p.message,
        ...(p.default !== undefined ? { default: p.default } : {}),
        ...(p.validate ? { validate: p.validate } : {}),
        transformer: (typed: string, { isFinal }: { isFinal: boolean }) => (isFinal ? style.accent(p.shown ? p.shown(typed) : typed) : typed),
        theme: theme(style, withHelp(style, p.help, p.hint, true), []),
      }),
    confirm: (p: ConfirmPrompt) =>
      prompt<boolean>({ type: 'confirm', message: p.message, default: p.default ?? true, theme: theme(style, (t) => style.bold(t), []) }),
    say: (text: string) => {
      io.stdout.write(text);
    },
  };
}

/**
 * The question line while it is asked: the question, then dim help lines; for typed answers a
 * last line with a marker where the answer appears. Once answered only the question remains,
 * followed by the answer.
 */
function withHelp(style: Style, help?: string, hint?: string, typed = false): (text: string, status: Status) => string {
  return (text, status) => {
    if (status === 'done') return style.bold(text);
    const lines = [style.bold(text)];
    if (help) lines.push('  ' + style.dim(help));
    if (hint) lines.push('  ' + style.dim(hint));
    if (typed) lines.push('  ' + style.accent('›'));
    return lines.join('\n');
  };
}

function theme(style: Style, message: (text: string, status: Status) => string, extraKeys: [string, string][]): Record<string, unknown> {
  return {
    prefix: { idle: style.accent('?'), done: style.good('✔') },
    style: {
      message,
      answer: (t: string) => style.accent(t),
      error: (t: string) => style.bad(`> ${t}`),
      defaultAnswer: (t: string) => style.dim(`(${t})`),
      help: (t: string) => style.dim(t),
      highlight: (t: string) => style.accent(t),
      key: (t: string) => style.accent(`<${t}>`),
      description: (t: string) => style.dim(t),
      disabled: (t: string) => style.dim(t),
      keysHelpTip: (keys: [string, string][]) =>
        [...keys, ...extraKeys].map(([k, a]) => `${style.bold(k)} ${style.dim(a)}`).join(style.dim(' • ')),
    },
  };
}

/**
 * inquirer pipes into the output and ends it after each prompt, so a terminal stream is passed
 * as is (Node never closes stdio), and anything else (tests' in-memory IO) gets a fresh stream
 * per prompt that forwards to io.stdout.
 */
function outputFor(io: IO): NodeJS.WritableStream {
  const out = io.stdout as Partial<NodeJS.WriteStream>;
  if (out.isTTY === true && typeof out.on === 'function') return io.stdout as NodeJS.WriteStream;
  return new Writable({
    write(chunk: Buffer | string, _enc, done) {
      io.stdout.write(String(chunk));
      done();
    },
  });
}
