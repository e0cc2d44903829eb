/**
 * The error kinds tandem raises on purpose. Each kind maps to one documented exit code
 * (see src/cli/exit-codes.ts and README.md "Exit codes"); anything else is a bug.
 */
import type { Problem } from './problems.js';

/** Bad input: an option, a file, data. Exit code 2. */
export class InputError extends Error {
  readonly problems: Problem[];
  constructor(message: string, problems: Problem[] = []) {
    super(message);
    this.name = 'InputError';
    this.problems = problems;
  }
}

/** Output refused or failed (file exists without --force, cannot write). Exit code 3. */
export class OutputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'OutputError';
  }
}

/** The user cancelled an interactive session (Ctrl-C). Exit code 130, nothing written. */
export class CancelledError extends Error {
  constructor(message = 'cancelled: nothing was written') {
    super(message);
    this.name = 'CancelledError';
  }
}

/**
 * A statistic cannot be computed from these data (too few values, no variation, ...).
 * `code` is from a closed set so callers and tests can tell cases apart; the message says what
 * it means for the user. Exit code 2 when it reaches the CLI.
 */
export type StatsErrorCode =
  | 'too-few'
  | 'no-variation'
  | 'not-finite'
  | 'invalid-option'
  | 'not-binary'
  | 'unsupported';

export class StatsError extends Error {
  readonly code: StatsErrorCode;
  constructor(code: StatsErrorCode, message: string) {
    super(message);
    this.name = 'StatsError';
    this.code = code;
  }
}
