/**
 * A pretend terminal for driving the real inquirer prompts: keys are written into a PassThrough
 * that the prompts read as stdin, and everything drawn is collected (escape codes stripped) so a
 * test can wait until a prompt is on screen, then type. Waiting is event-driven (each write wakes
 * the waiters), never timed.
 *
 * Keys for one prompt are sent only once that prompt is drawn: readline hands every key of a
 * chunk to the prompt that is listening, so keys sent early would go to the previous prompt.
 */
import { PassThrough } from 'node:stream';
import { stripVTControlCharacters } from 'node:util';
import type { IO } from '../../src/cli/io.js';

export const KEY = {
  enter: '\r',
  up: '\x1b[A',
  down: '\x1b[B',
  backspace: '\x7f',
  ctrlC: '\x03',
} as const;

export interface Terminal {
  io: IO & { out(): string; err(): string };
  /** Resolves once `text` appears in what was drawn since the previous wait returned. */
  waitFor(text: string | RegExp): Promise<string>;
  /** Types characters or keys (see KEY). */
  type(...keys: string[]): void;
  /** Everything drawn so far, escape codes removed. */
  screen(): string;
  /** Everything drawn so far, as written (escape codes included). */
  raw(): string;
  /** Ends the input (as when a pipe closes). */
  endInput(): void;
}

export function terminal(opts: { color?: boolean } = {}): Terminal {
  const stdin = new PassThrough();
  let out = '';
  let err = '';
  let mark = 0;
  let waiters: (() => void)[] = [];
  const wake = (): void => {
    const ws = waiters;
    waiters = [];
    for (const w of ws) w();
  };
  const io = {
    stdout: { write: (s: string) => ((out += s), wake(), true) },
    stderr: { write: (s: string) => ((err += s), true) },
    stdin,
    interactive: true,
    color: opts.color ?? false,
    env: {},
    cwd: process.cwd(),
    out: () => stripVTControlCharacters(out),
    err: () => err,
  };
  const waitFor = (text: string | RegExp): Promise<string> =>
    new Promise((resolve) => {
      const check = (): void => {
        const fresh = stripVTControlCharacters(out.slice(mark));
        const found = typeof text === 'string' ? fresh.includes(text) : text.test(fresh);
        if (found) {
          mark = out.length;
          resolve(fresh);
        } else waiters.push(check);
      };
      check();
    });
  return {
    io,
    waitFor,
    type: (...keys: string[]) => {
      for (const k of keys) stdin.write(k);
    },
    screen: () => stripVTControlCharacters(out),
    raw: () => out,
    endInput: () => stdin.end(),
  };
}
