/**
 * Walking the question path without prompts: which questions are still missing, which given
 * answers apply, and a scripted adapter driving runInterview (no streams).
 */
import { describe, expect, it } from 'vitest';
import type { Answers, Question } from '../../src/engine/types.js';
import { CancelledError } from '../../src/errors.js';
import type { PromptAdapter } from '../../src/interview/adapter.js';
import { BACK_VALUE, HELP_VALUE, firstSentence, runInterview } from '../../src/interview/interview.js';
import { checkAnswers, missingAnswers } from '../../src/interview/walk.js';
import { hiveNext } from './hives.js';
import { memoryIO } from '../helpers/io.js';

describe('missingAnswers', () => {
  it('lists every question when nothing is answered, up to the first choice', () => {
    // unit is text (passed with a stand-in), layout is a choice: what follows depends on it.
    expect(missingAnswers(hiveNext, {}).map((q) => q.id)).toEqual(['unit', 'layout']);
  });

  it('follows the branch the answers choose', () => {
    expect(missingAnswers(hiveNext, { unit: 'hive', layout: 'one-each' }).map((q) => q.id)).toEqual(['assignment']);
    expect(missingAnswers(hiveNext, { unit: 'hive', layout: 'one-each', assignment: 'lot' }).map((q) => q.id)).toEqual(['hives']);
    expect(missingAnswers(hiveNext, { unit: 'hive', layout: 'both-each-hive', order: 'no', hives: 4 }).map((q) => q.id)).toEqual(['note']);
  });

  it('is empty when the answers are complete', () => {
    expect(missingAnswers(hiveNext, { unit: 'hive', layout: 'one-each', assignment: 'lot', hives: 4, note: '' })).toEqual([]);
  });
});

describe('checkAnswers', () => {
  it('tells which given answers do not apply', () => {
    const r = checkAnswers(hiveNext, { unit: 'hive', layout: 'one-each', assignment: 'lot', order: 'yes', hives: 4, note: 'x' });
    expect(r.unused).toEqual(['order']);
    expect(r.used).toEqual({ unit: 'hive', layout: 'one-each', assignment: 'lot', hives: 4, note: 'x' });
    expect(r.missing).toEqual([]);
  });

  it('does not call answers unused while an earlier choice is missing', () => {
    expect(checkAnswers(hiveNext, { unit: 'hive', hives: 4 }).unused).toEqual([]);
  });

  it('stops a rule base that asks the same question twice', () => {
    const loop = (): Question => ({ id: 'x', type: 'text', text: 'x?', help: 'x.' });
    expect(() => checkAnswers(loop, { x: 'a' })).toThrow(/asked 'x' again/);
  });
});

/** A scripted adapter: each call takes the next scripted reply; records what it was shown. */
function scripted(replies: (string | boolean)[]): PromptAdapter & { shown: string[]; said: string[] } {
  const shown: string[] = [];
  const said: string[] = [];
  const take = (): string | boolean => {
    if (replies.length === 0) throw new Error('script ran out of replies');
    return replies.shift() as string | boolean;
  };
  return {
    shown,
    said,
    select: async (p) => (shown.push(p.message), String(take())),
    input: async (p) => {
      shown.push(p.message);
      // Validate as the real prompt does: a rejected reply is an error in the script.
      const r = String(take());
      const ok = p.validate ? p.validate(r) : true;
      if (ok !== true) throw new Error(`scripted reply '${r}' rejected: ${ok}`);
      return r;
    },
    confirm: async (p) => (shown.push(p.message), Boolean(take())),
    say: (text) => void said.push(text),
  };
}

describe('runInterview with an injected adapter', () => {
  it('walks again after a change, so later answers that no longer apply are dropped', async () => {
    // Answer order = 'no', then at the hive count type '<', then take '< Back' at the order question.
    const ask = scripted(['hive', 'both-each-hive', 'no', '<', BACK_VALUE, 'one-each', 'picked', '30', '']);
    const answers = await runInterview({ next: hiveNext, io: memoryIO(), ask });
    expect(answers).toEqual({ unit: 'hive', layout: 'one-each', assignment: 'picked', hives: 30, note: '' });
    expect(ask.shown).toEqual([
      '(question 1) What is each measurement taken on?',
      '(question 2) How did the two syrups reach the hives?',
      '(question 3) Was the order of the syrups drawn by lot for each hive?',
      '(question 4) How many hives took part?',
      '(question 3) Was the order of the syrups drawn by lot for each hive?',
      '(question 2) How did the two syrups reach the hives?',
      '(question 3) How was each hive given its syrup?',
      '(question 4) How many hives took part?',
      '(question 5) Anything else about the apiary?',
    ]);
  });

  it('shows help and asks the same question again', async () => {
    const ask = scripted([HELP_VALUE, 'one-each', 'lot', '?', '7', '']);
    const answers = await runInterview({ next: hiveNext, io: memoryIO(), ask, initial: { unit: 'hive' } });
    expect(answers.hives).toBe(7);
    expect(ask.said).toHaveLength(2);
    expect(ask.said[0]).toContain('The answers:');
  });

  it('maps inquirer cancellation errors to CancelledError', async () => {
    const err = Object.assign(new Error('User force closed the prompt with SIGINT'), { name: 'ExitPromptError' });
    const ask: PromptAdapter = { ...scripted([]), input: async () => Promise.reject(err) };
    await expect(runInterview({ next: hiveNext, io: memoryIO(), ask })).rejects.toBeInstanceOf(CancelledError);
  });

  it('lets other errors through unchanged', async () => {
    const ask: PromptAdapter = { ...scripted([]), input: async () => Promise.reject(new TypeError('boom')) };
    await expect(runInterview({ next: hiveNext, io: memoryIO(), ask })).rejects.toBeInstanceOf(TypeError);
  });

  it('returns initial answers that do not apply as given, so the caller can report them', async () => {
    const ask = scripted(['one-each', 'lot', '5', '']);
    const answers = await runInterview({ next: hiveNext, io: memoryIO(), ask, initial: { unit: 'hive', order: 'no' } });
    expect(answers).toEqual({ unit: 'hive', layout: 'one-each', assignment: 'lot', hives: 5, note: '', order: 'no' });
    expect(checkAnswers(hiveNext, answers).unused).toEqual(['order']);
  });

  it('keeps initial answers even where the session would have asked', async () => {
    const initial: Answers = { layout: 'both-each-hive', order: 'yes' };
    const ask = scripted(['frame', '3', 'n/a']);
    expect(await runInterview({ next: hiveNext, io: memoryIO(), ask, initial })).toEqual({ unit: 'frame', layout: 'both-each-hive', order: 'yes', hives: 3, note: 'n/a' });
  });
});

describe('firstSentence (the dim help line)', () => {
  it('stops at the first full stop that ends a sentence, not at e.g. or i.e.', () => {
    expect(firstSentence('Count loaves, e.g. 24 loaves per oven. Not trays.')).toBe('Count loaves, e.g. 24 loaves per oven.');
    expect(firstSentence('The kiln, i.e. the firing chamber, matters! More text.')).toBe('The kiln, i.e. the firing chamber, matters!');
    expect(firstSentence('A margin of 0.5 mm\n  is common. Or less.')).toBe('A margin of 0.5 mm is common.');
    expect(firstSentence('No full stop at all')).toBe('No full stop at all');
  });
});
