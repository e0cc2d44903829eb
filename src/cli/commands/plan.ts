/** `tandem plan`: placeholder until its issue lands. */
import type { IO } from '../io.js';
import { EXIT } from '../exit-codes.js';

export default async function plan(_argv: string[], io: IO): Promise<number> {
  io.stderr.write('tandem plan: not built yet\n');
  return EXIT.internal;
}
