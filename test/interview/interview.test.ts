/**
 * The interview driven through the real inquirer prompts: keys are typed into an injected input
 * stream and the drawn screen is read back (see terminal.ts). The questions are an invented
 * beekeeping set (hives.ts), so these tests do not depend on the real rule base.
 */
import { mkdtempSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { CancelledError } from '../../src/errors.js';
import { writeAnswersFile } from '../../src/interview/answers-file.js';
import { runInterview } from '../../src/interview/interview.js';
import { hiveNext, hiveRules } from './hives.js';
import { KEY, terminal } from './terminal.js';

/** Settles to the answers or the error, so a rejection is never left unhandled. */
const settle = <T>(p: Promise<T>): Promise<T | Error> => p.then((v) => v, (e: Error) => e);

describe('runInterview through inquirer', () => {
  it('asks each question on the path once and returns the answers', async () => {
    const t = terminal();
    const done = settle(runInterview({ next: hiveNext, io: t.io }));
    let screen = await t.waitFor('(question 1) What is each measurement taken on?');
    expect(screen).toContain('The thing that is weighed or counted once per syrup.'); // dim help line
    t.type('hive', KEY.enter);
    screen = await t.waitFor('(question 2) How did the two syrups reach the hives?');
    expect(screen).toContain('Each hive got one syrup');
    expect(screen).toContain('< Back to the previous question');
    expect(screen).toContain('? Explain this question');
    // The highlighted choice's own help shows below the list.
    expect(screen).toContain('Hive 7 had the thin syrup in August');
    t.type(KEY.down, KEY.enter);
    await t.waitFor('(question 3) How was each hive given its syrup?');
    t.type(KEY.enter);
    await t.waitFor('(question 4) How many hives took part?');
    t.type('24', KEY.enter);
    screen = await t.waitFor('(question 5) Anything else about the apiary?');
    expect(screen).toContain('or blank to skip');
    t.type(KEY.enter);
    expect(await done).toEqual({ unit: 'hive', layout: 'one-each', assignment: 'lot', hives: 24, note: '' });
    expect(t.screen()).toContain('✔ (question 5) Anything else about the apiary? (left blank)');
  });

  it('goes back, changes an answer, drops the answers that no longer apply and suggests the rest', async () => {
    const t = terminal();
    const done = settle(runInterview({ next: hiveNext, io: t.io }));
    await t.waitFor('(question 1) What is each');
    t.type('hive', KEY.enter);
    await t.waitFor('(question 2) How did the two syrups');
    t.type(KEY.enter); // each hive got both syrups
    await t.waitFor('(question 3) Was the order of the syrups drawn by lot');
    t.type(KEY.enter); // yes
    await t.waitFor('(question 4) How many hives');
    t.type('12', KEY.enter);
    await t.waitFor('(question 5) Anything else');
    t.type('<', KEY.enter); // typed keyword: back
    let screen = await t.waitFor('(question 4) How many hives');
    expect(screen).toContain('(12)'); // the earlier answer is suggested
    t.type('<', KEY.enter);
    screen = await t.waitFor('(question 3) Was the order');
    expect(screen).toMatch(/❯ Yes, drawn by lot/); // the earlier choice is highlighted
    t.type(KEY.down, KEY.down, KEY.enter); // past "No" and the separator to "< Back ..."
    screen = await t.waitFor('(question 2) How did the two syrups');
    expect(screen).toMatch(/❯ Each hive got both syrups/);
    t.type(KEY.down, KEY.enter); // change: each hive got one syrup
    await t.waitFor('(question 3) How was each hive given its syrup?');
    t.type(KEY.down, KEY.enter); // the beekeeper picked
    screen = await t.waitFor('(question 4) How many hives');
    expect(screen).toContain('(12)');
    t.type(KEY.enter); // keep the suggested 12
    await t.waitFor('(question 5) Anything else');
    t.type('queen lost in hive 3', KEY.enter);
    const answers = await done;
    expect(answers).toEqual({ unit: 'hive', layout: 'one-each', assignment: 'picked', hives: 12, note: 'queen lost in hive 3' });
    expect(answers).not.toHaveProperty('order');
  });

  it('goes back from a list by typing < (the list jumps to the back entry)', async () => {
    const t = terminal();
    const done = settle(runInterview({ next: hiveNext, io: t.io }));
    await t.waitFor('(question 1) What is each');
    t.type('frame', KEY.enter);
    await t.waitFor('(question 2) How did');
    t.type('<');
    await t.waitFor('❯ < Back to the previous question');
    t.type(KEY.enter);
    const screen = await t.waitFor('(question 1) What is each');
    expect(screen).toContain('(frame)');
    t.type(KEY.backspace, 'comb frame', KEY.enter); // Backspace clears the suggestion first
    await t.waitFor('(question 2) How did');
    t.type(KEY.down, KEY.enter);
    await t.waitFor('(question 3)');
    t.type(KEY.enter);
    await t.waitFor('(question 4)');
    t.type('30', KEY.enter);
    await t.waitFor('(question 5)');
    t.type(KEY.enter);
    expect(await done).toMatchObject({ unit: 'comb frame', layout: 'one-each', hives: 30 });
  });

  it('offers no way back on the first question', async () => {
    const t = terminal();
    const done = settle(runInterview({ next: hiveNext, io: t.io }));
    await t.waitFor('(question 1)');
    t.type('<', KEY.enter);
    await t.waitFor('This is the first question; there is nothing to go back to.');
    t.type(KEY.ctrlC);
    expect(await done).toBeInstanceOf(CancelledError);
  });

  it('re-asks a number until it is a whole number in range', async () => {
    const t = terminal();
    const done = settle(runInterview({ next: hiveNext, io: t.io, initial: { unit: 'hive', layout: 'one-each', assignment: 'lot' } }));
    const screen = await t.waitFor('(question 1) How many hives took part?');
    expect(screen).toContain('A whole number from 2 to 400.');
    t.type(KEY.enter);
    await t.waitFor('An answer is needed here');
    t.type('abc', KEY.enter);
    await t.waitFor("'abc' is not a number");
    t.type(KEY.backspace, KEY.backspace, KEY.backspace, '1', KEY.enter);
    await t.waitFor('1 is too small. Allowed: a whole number from 2 to 400.');
    t.type(KEY.backspace, '401', KEY.enter);
    await t.waitFor('401 is too large.');
    t.type(KEY.backspace, KEY.backspace, KEY.backspace, '12.5', KEY.enter);
    await t.waitFor('12.5 is not a whole number.');
    t.type(KEY.backspace, KEY.backspace, KEY.backspace, KEY.backspace, '0x10', KEY.enter);
    await t.waitFor("'0x10' is not a number");
    t.type(KEY.backspace, KEY.backspace, KEY.backspace, KEY.backspace, '12', KEY.enter);
    await t.waitFor('(question 2) Anything else');
    t.type(KEY.enter);
    expect(await done).toMatchObject({ hives: 12 });
  });

  it('shows the whole explanation on request and asks again', async () => {
    const t = terminal();
    const done = settle(runInterview({ next: hiveNext, io: t.io, initial: { unit: 'hive' } }));
    await t.waitFor('(question 1) How did the two syrups');
    t.type(KEY.down, KEY.down, KEY.enter); // "? Explain this question" (no back entry here)
    let screen = await t.waitFor('The answers:');
    expect(screen).toContain('A hive fed syrup A in August and syrup B in September tried both.');
    expect(screen).toContain('- Each hive got one syrup: Hives on the north terrace had thin syrup, the others thick.');
    await t.waitFor('(question 1) How did the two syrups'); // asked again
    t.type(KEY.enter);
    await t.waitFor('(question 2) Was the order');
    t.type(KEY.enter);
    await t.waitFor('(question 3) How many hives');
    t.type('?', KEY.enter);
    screen = await t.waitFor('Allowed: a whole number from 2 to 400.');
    expect(screen).toContain('Count hives, not frames or bees. For example 24 hives.');
    await t.waitFor('(question 3) How many hives'); // asked again
    t.type('8', KEY.enter);
    await t.waitFor('(question 4)');
    t.type(KEY.enter);
    expect(await done).toEqual({ unit: 'hive', layout: 'both-each-hive', order: 'yes', hives: 8, note: '' });
  });

  it('keeps initial answers and asks only the missing ones', async () => {
    const t = terminal();
    const done = settle(runInterview({ next: hiveNext, io: t.io, initial: { unit: 'nucleus hive', layout: 'one-each', hives: 16 } }));
    const screen = await t.waitFor('(question 1) How was each hive given its syrup?');
    expect(screen).not.toContain('< Back');
    t.type(KEY.enter);
    await t.waitFor('(question 2) Anything else');
    t.type('north terrace', KEY.enter);
    expect(await done).toEqual({ unit: 'nucleus hive', layout: 'one-each', assignment: 'lot', hives: 16, note: 'north terrace' });
    expect(t.screen()).not.toContain('What is each measurement');
  });

  it('returns at once when the initial answers are complete', async () => {
    const t = terminal();
    const initial = { unit: 'hive', layout: 'one-each', assignment: 'lot', hives: 9, note: '' };
    expect(await runInterview({ next: hiveNext, io: t.io, initial })).toEqual(initial);
    expect(t.screen()).toBe('');
  });

  it('Ctrl-C raises CancelledError and nothing is written', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'tandem-interview-'));
    const t = terminal();
    // What `tandem advise` does: interview, then write. Cancelling must stop before the write.
    const flow = async (): Promise<void> => {
      const answers = await runInterview({ next: hiveNext, io: t.io });
      await writeAnswersFile(join(dir, 'answers.yaml'), answers, hiveRules);
    };
    const done = settle(flow());
    await t.waitFor('(question 1)');
    t.type('hive', KEY.enter);
    await t.waitFor('(question 2)');
    t.type(KEY.ctrlC);
    const err = await done;
    expect(err).toBeInstanceOf(CancelledError);
    expect((err as Error).message).toContain('nothing was written');
    expect(readdirSync(dir)).toEqual([]);
  });

  it('cancels when the input ends before the interview is finished', async () => {
    const t = terminal();
    const done = settle(runInterview({ next: hiveNext, io: t.io }));
    await t.waitFor('(question 1)');
    t.endInput();
    const err = await done;
    expect(err).toBeInstanceOf(CancelledError);
    expect((err as Error).message).toContain('input ended');
  });

  it('draws without colour codes when colour is off, and with them when on', async () => {
    for (const color of [false, true]) {
      const t = terminal({ color });
      const done = settle(runInterview({ next: hiveNext, io: t.io, initial: { unit: 'hive', layout: 'one-each', assignment: 'lot', hives: 5 } }));
      await t.waitFor('(question 1)');
      t.type(KEY.enter);
      await done;
      // SGR sequences (ESC [ ... m) set colours and weights; cursor movement codes are fine.
      expect(/\x1b\[[0-9;]*m/.test(t.raw())).toBe(color);
    }
  });
});
