/**
 * The prompt layer as an adapter: the interview decides what to ask (from the rule base, through
 * `next`), an adapter only shows prompts and returns what was typed or chosen. The real adapter
 * (src/interview/inquirer-adapter.ts) drives inquirer on injectable streams; tests may pass a
 * scripted adapter instead. Nothing here imports inquirer.
 *
 * Cancellation is a named error: an adapter throws CancelledError (src/errors.ts) when the user
 * presses Ctrl-C or the input ends, and the caller exits 130 without writing anything.
 */
import { CancelledError } from '../errors.js';

export interface SelectChoice {
  value: string;
  /** What the list shows. */
  name: string;
  /** Shown below the list while this choice is highlighted. */
  description?: string;
}

/** A list entry: a choice, or a separator line between groups of choices. */
export type SelectItem = SelectChoice | { separator: true };

export interface SelectPrompt {
  /** The question, shown on the prompt line (kept after answering). */
  message: string;
  /** Dim explanation shown under the question while it is asked. */
  help?: string;
  choices: SelectItem[];
  /** The value highlighted at first (an earlier answer when the user came back). */
  default?: string;
  /** Extra key hints for the footer, e.g. [['<', 'back'], ['?', 'explain']]. */
  keys?: [key: string, action: string][];
}

export interface InputPrompt {
  message: string;
  help?: string;
  /** A second dim line: what may be typed, e.g. "A whole number from 2 to 500." */
  hint?: string;
  /** Suggested answer; Enter accepts it, Backspace on an empty line clears it. */
  default?: string;
  /** true, or the message shown under the prompt while the user corrects the answer. */
  validate?: (typed: string) => true | string;
  /** How the accepted answer reads after the question, e.g. "(left blank)" for ''. */
  shown?: (typed: string) => string;
}

export interface ConfirmPrompt {
  message: string;
  default?: boolean;
}

export interface PromptAdapter {
  select(p: SelectPrompt): Promise<string>;
  input(p: InputPrompt): Promise<string>;
  confirm(p: ConfirmPrompt): Promise<boolean>;
  /** Text between prompts (the full explanation of a question, shown on request). */
  say(text: string): void;
}

/** The names inquirer gives its cancellation errors (Ctrl-C, abort signal, prompt.cancel()). */
const CANCEL_NAMES = new Set(['ExitPromptError', 'AbortPromptError', 'CancelPromptError']);

/**
 * Maps inquirer's cancellation errors to CancelledError; anything else is returned unchanged.
 * Matching by name keeps @inquirer/core out of our imports (inquirer does not re-export them).
 */
export function toCancelled(err: unknown): unknown {
  if (err instanceof CancelledError) return err;
  if (err instanceof Error && CANCEL_NAMES.has(err.name)) {
    const cause = (err as Error & { cause?: unknown }).cause;
    if (cause instanceof CancelledError) return cause;
    return new CancelledError();
  }
  return err;
}
