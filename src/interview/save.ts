/**
 * The last screen of the interview: after the recommendation is shown, offer to save the answers
 * file and the analysis plan. This only asks; the caller writes (through writeFileAtomic), so a
 * Ctrl-C here still leaves nothing behind. A path that already exists is refused at the prompt
 * unless `force` (the caller's --force), because files are never replaced silently.
 */
import { existsSync, statSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import type { IO } from '../cli/io.js';
import { toCancelled, type PromptAdapter } from './adapter.js';

export interface SaveChoice {
  /** Where to write the answers file (as typed, relative to io.cwd), or absent when declined. */
  answersPath?: string;
  planPath?: string;
}

export interface OfferSaveOptions {
  /** Defaults to the inquirer adapter on io.stdin / io.stdout. */
  ask?: PromptAdapter;
  /** Allow naming an existing file (the caller passes --force on to the write). */
  force?: boolean;
  /** Which files to offer (default both): e.g. not the plan when a flag already wrote it. */
  offer?: { answers?: boolean; plan?: boolean };
}

export async function offerSave(io: IO, defaults: { answersPath: string; planPath: string }, opts: OfferSaveOptions = {}): Promise<SaveChoice> {
  try {
    const ask = opts.ask ?? (await (await import('./inquirer-adapter.js')).inquirerAdapter(io));
    const choice: SaveChoice = {};
    const taken: string[] = [];
    const askPath = async (what: string, def: string): Promise<string | undefined> => {
      if (!(await ask.confirm({ message: `Save ${what}?`, default: true }))) return undefined;
      const typed = await ask.input({
        message: `File name for ${what}:`,
        default: def,
        validate: (s) => checkPath(s.trim(), io.cwd, taken, opts.force ?? false),
      });
      const p = typed.trim();
      taken.push(resolve(io.cwd, p));
      return p;
    };
    if (opts.offer?.answers !== false) {
      const a = await askPath('your answers (reusable with tandem advise --answers)', defaults.answersPath);
      if (a !== undefined) choice.answersPath = a;
    }
    if (opts.offer?.plan !== false) {
      const p = await askPath('the analysis plan (for tandem analyze)', defaults.planPath);
      if (p !== undefined) choice.planPath = p;
    }
    return choice;
  } catch (err) {
    throw toCancelled(err);
  }
}

/** true, or why this path cannot be used, with what to do instead. */
export function checkPath(p: string, cwd: string, taken: string[], force: boolean): true | string {
  if (p === '') return 'Type a file name, for example answers.yaml.';
  const full = resolve(cwd, p);
  if (taken.includes(full)) return 'That name is already used for the other file; choose another.';
  const dir = dirname(full);
  if (!existsSync(dir) || !statSync(dir).isDirectory()) return `The folder ${dir} does not exist; choose a path in an existing folder.`;
  if (existsSync(full)) {
    if (statSync(full).isDirectory()) return `${p} is a folder; type a file name.`;
    if (!force) return `${p} exists and tandem never replaces a file unless run with --force; choose another name.`;
  }
  return true;
}
