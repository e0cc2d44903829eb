/**
 * Writing files without leaving anything half-written, and never over a user's file unless told.
 * Write to a temporary file beside the target, then rename it into place.
 */
import { existsSync } from 'node:fs';
import { rename, unlink, writeFile } from 'node:fs/promises';
import { basename, dirname, join } from 'node:path';
import { OutputError } from '../errors.js';

export async function writeFileAtomic(path: string, content: string, opts: { force?: boolean } = {}): Promise<void> {
  if (!opts.force && existsSync(path)) {
    throw new OutputError(`${path} exists; nothing was written (use --force to replace it)`);
  }
  const tmp = join(dirname(path), `.tandem-tmp-${process.pid}-${Date.now()}-${basename(path)}`);
  try {
    await writeFile(tmp, content, { encoding: 'utf8', flag: 'wx' });
    await rename(tmp, path);
  } catch (err) {
    await unlink(tmp).catch(() => undefined);
    if (err instanceof OutputError) throw err;
    const msg = err instanceof Error ? err.message : String(err);
    throw new OutputError(`could not write ${path}: ${msg}`);
  }
}
