/**
 * The offer to save the answers and the plan, driven through the real prompts. offerSave only
 * asks; the caller writes.
 */
import { mkdirSync, mkdtempSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { CancelledError } from '../../src/errors.js';
import { checkPath, offerSave } from '../../src/interview/save.js';
import { KEY, terminal } from './terminal.js';

const settle = <T>(p: Promise<T>): Promise<T | Error> => p.then((v) => v, (e: Error) => e);
const defaults = { answersPath: 'answers.yaml', planPath: 'plan.yaml' };

function workDir(): string {
  return mkdtempSync(join(tmpdir(), 'tandem-save-'));
}

describe('offerSave', () => {
  it('accepts the suggested answers file name and can decline the plan', async () => {
    const t = terminal();
    t.io.cwd = workDir();
    const done = settle(offerSave(t.io, defaults));
    await t.waitFor('Save your answers');
    t.type(KEY.enter); // yes is the default
    const screen = await t.waitFor('File name for your answers');
    expect(screen).toContain('(answers.yaml)');
    t.type(KEY.enter);
    await t.waitFor('Save the analysis plan');
    t.type('n', KEY.enter);
    expect(await done).toEqual({ answersPath: 'answers.yaml' });
    expect(readdirSync(t.io.cwd)).toEqual([]); // offerSave asks, it does not write
  });

  it('refuses a name that exists, then takes another', async () => {
    const t = terminal();
    t.io.cwd = workDir();
    writeFileSync(join(t.io.cwd, 'answers.yaml'), 'a colleague\'s file');
    const done = settle(offerSave(t.io, defaults));
    await t.waitFor('Save your answers');
    t.type(KEY.enter);
    await t.waitFor('File name for your answers');
    t.type(KEY.enter);
    await t.waitFor('answers.yaml exists and tandem never replaces a file unless run with --force');
    t.type('hive-answers.yaml', KEY.enter);
    await t.waitFor('Save the analysis plan');
    t.type(KEY.enter);
    await t.waitFor('File name for the analysis plan');
    t.type(KEY.enter);
    expect(await done).toEqual({ answersPath: 'hive-answers.yaml', planPath: 'plan.yaml' });
  });

  it('accepts an existing name when the caller was given --force', async () => {
    const t = terminal();
    t.io.cwd = workDir();
    writeFileSync(join(t.io.cwd, 'plan.yaml'), 'old plan');
    const done = settle(offerSave(t.io, defaults, { force: true }));
    await t.waitFor('Save your answers');
    t.type('n', KEY.enter);
    await t.waitFor('Save the analysis plan');
    t.type('y', KEY.enter);
    await t.waitFor('File name for the analysis plan');
    t.type(KEY.enter);
    expect(await done).toEqual({ planPath: 'plan.yaml' });
  });

  it('offers only the files asked for', async () => {
    const t = terminal();
    t.io.cwd = workDir();
    const done = settle(offerSave(t.io, defaults, { offer: { answers: false } }));
    await t.waitFor('Save the analysis plan');
    t.type(KEY.enter);
    await t.waitFor('File name for the analysis plan');
    t.type(KEY.enter);
    expect(await done).toEqual({ planPath: 'plan.yaml' });
    expect(t.screen()).not.toContain('Save your answers');
  });

  it('Ctrl-C raises CancelledError', async () => {
    const t = terminal();
    t.io.cwd = workDir();
    const done = settle(offerSave(t.io, defaults));
    await t.waitFor('Save your answers');
    t.type(KEY.enter);
    await t.waitFor('File name for your answers');
    t.type(KEY.ctrlC);
    expect(await done).toBeInstanceOf(CancelledError);
  });
});

describe('checkPath', () => {
  it('says why a path cannot be used', () => {
    const dir = workDir();
    mkdirSync(join(dir, 'frames'));
    writeFileSync(join(dir, 'taken.yaml'), 'x');
    expect(checkPath('new.yaml', dir, [], false)).toBe(true);
    expect(checkPath('', dir, [], false)).toMatch(/Type a file name/);
    expect(checkPath('taken.yaml', dir, [], false)).toMatch(/exists/);
    expect(checkPath('taken.yaml', dir, [], true)).toBe(true);
    expect(checkPath('frames', dir, [], true)).toMatch(/is a folder/);
    expect(checkPath('no-such-folder/plan.yaml', dir, [], false)).toMatch(/does not exist/);
    expect(checkPath('a.yaml', dir, [join(dir, 'a.yaml')], false)).toMatch(/already used for the other file/);
  });
});
