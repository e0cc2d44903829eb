/**
 * Problems are data: a closed set of codes, a position and a message. Loaders collect every
 * problem of a file and report them together; `formatProblem` shows the offending line with a
 * caret under the column.
 */
export type ProblemCode =
  | 'yaml-syntax'
  | 'schema'
  | 'unknown-key'
  | 'missing-key'
  | 'wrong-type'
  | 'unknown-value'
  | 'duplicate-id'
  | 'dangling-ref'
  | 'unknown-operator'
  | 'unreachable'
  | 'never-asked'
  | 'incomplete'
  | 'ambiguous'
  | 'format-version'
  | 'data';

export interface Problem {
  code: ProblemCode;
  message: string;
  file?: string;
  /** 1-based line, when known. */
  line?: number;
  /** 1-based column, when known. */
  col?: number;
  /** What is allowed, or how to fix it. */
  hint?: string;
}

/** `file:line:col: message` plus, when the source text is given, the line and a caret. */
export function formatProblem(p: Problem, source?: string): string {
  const where = [p.file, p.line, p.col].filter((x) => x !== undefined).join(':');
  const head = `${where ? where + ': ' : ''}${p.message}${p.hint ? ` (${p.hint})` : ''}`;
  if (source === undefined || p.line === undefined) return head;
  const text = source.split(/\r?\n/)[p.line - 1];
  if (text === undefined) return head;
  const gutter = `${p.line} | `;
  const caret = ' '.repeat(gutter.length + Math.max(0, (p.col ?? 1) - 1)) + '^';
  return `${head}\n  ${gutter}${text}\n  ${caret}`;
}
