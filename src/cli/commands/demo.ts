/** `tandem demo`: placeholder until its issue lands. */
import type { IO } from '../io.js';
import { EXIT } from '../exit-codes.js';

export default async function demo(_argv: string[], io: IO): Promise<number> {
  io.stderr.write('tandem demo: not built yet\n');
  return EXIT.internal;
}
