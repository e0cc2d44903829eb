/**
 * In-memory IO for calling `run(argv, io)` in tests: what the command writes is collected as
 * strings, stdin is an empty (or given) stream, and colours are off unless asked for.
 */
import { Readable } from 'node:stream';
import type { IO } from '../../src/cli/io.js';

export interface MemoryIO extends IO {
  out(): string;
  err(): string;
}

export function memoryIO(opts: { cwd?: string; color?: boolean; interactive?: boolean; env?: Record<string, string | undefined>; stdin?: string[] } = {}): MemoryIO {
  let out = '';
  let err = '';
  return {
    stdout: { write: (s: string) => (out += s) },
    stderr: { write: (s: string) => (err += s) },
    stdin: Readable.from(opts.stdin ?? []),
    interactive: opts.interactive ?? false,
    color: opts.color ?? false,
    env: opts.env ?? {},
    cwd: opts.cwd ?? process.cwd(),
    out: () => out,
    err: () => err,
  };
}
