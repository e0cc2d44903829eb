/** Documented exit codes (README.md "Exit codes"). */
export const EXIT = {
  ok: 0,
  /** The command ran and found a problem: an audit error finding, a failing rules or plan check. */
  findings: 1,
  /** Bad input: unknown option, unreadable or invalid file, data that cannot be analysed. */
  input: 2,
  /** Output not written: the file exists (use --force) or could not be written. */
  output: 3,
  /** An internal error: a bug in tandem. */
  internal: 70,
  /** Cancelled by the user (Ctrl-C); nothing was written. */
  cancelled: 130,
} as const;
export type ExitCode = (typeof EXIT)[keyof typeof EXIT];
