/** Where tandem's own files (rules/, schemas/, examples/) are, whether run from src/ or dist/. */
import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

let root: string | undefined;

export function projectRoot(): string {
  if (root) return root;
  let dir = dirname(fileURLToPath(import.meta.url));
  for (let i = 0; i < 6; i++) {
    if (existsSync(join(dir, 'package.json')) && existsSync(join(dir, 'rules'))) return (root = dir);
    dir = dirname(dir);
  }
  throw new Error('cannot find tandem installation folder (package.json beside rules/)');
}

export const rulesDir = (): string => join(projectRoot(), 'rules');
export const schemasDir = (): string => join(projectRoot(), 'schemas');
export const examplesDir = (): string => join(projectRoot(), 'examples');
