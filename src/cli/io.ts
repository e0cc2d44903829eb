/** What a command may touch of the outside world. Tests pass in-memory versions. */
export interface Writable {
  write(chunk: string): unknown;
}

export interface IO {
  stdout: Writable;
  stderr: Writable;
  /** Standard input as a stream (the interview reads keys from it). */
  stdin: NodeJS.ReadableStream;
  /** True when stdin and stdout are an interactive terminal. */
  interactive: boolean;
  /** True when colours may be used (a terminal and NO_COLOR not set). */
  color: boolean;
  env: Record<string, string | undefined>;
  cwd: string;
}

export function processIO(): IO {
  const interactive = Boolean(process.stdin.isTTY && process.stdout.isTTY);
  const color = Boolean(process.stdout.isTTY) && !process.env.NO_COLOR;
  return {
    stdout: process.stdout,
    stderr: process.stderr,
    stdin: process.stdin,
    interactive,
    color,
    env: process.env,
    cwd: process.cwd(),
  };
}
