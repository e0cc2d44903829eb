/**
 * An invented question set for the interview tests, independent of the real rule base: a
 * beekeeper compares two late-summer feeding syrups across hives. `next` returns the first
 * question on the path that has no answer, as the engine does.
 */
import type { Answers, Question } from '../../src/engine/types.js';

export const Q: Record<string, Question> = {
  unit: { id: 'unit', type: 'text', text: 'What is each measurement taken on?', help: 'The thing that is weighed or counted once per syrup. For example one hive, or one frame of comb.' },
  layout: {
    id: 'layout',
    type: 'choice',
    text: 'How did the two syrups reach the hives?',
    help: 'Whether each hive tried both syrups or only one. A hive fed syrup A in August and syrup B in September tried both.',
    choices: [
      { value: 'both-each-hive', label: 'Each hive got both syrups, one after the other', help: 'Hive 7 had the thin syrup in August and the thick one in September.' },
      { value: 'one-each', label: 'Each hive got one syrup', help: 'Hives on the north terrace had thin syrup, the others thick.' },
    ],
  },
  order: {
    id: 'order',
    type: 'choice',
    text: 'Was the order of the syrups drawn by lot for each hive?',
    help: 'Drawing the order stops the season from looking like a syrup effect. For example a coin toss per hive.',
    choices: [
      { value: 'yes', label: 'Yes, drawn by lot', help: 'A coin toss decided which syrup came first.' },
      { value: 'no', label: 'No, the same order for all', help: 'Every hive had thin syrup first.' },
    ],
  },
  assignment: {
    id: 'assignment',
    type: 'choice',
    text: 'How was each hive given its syrup?',
    help: 'Whether chance decided. Numbered slips drawn from a smoker can are chance; the beekeeper picking is not.',
    choices: [
      { value: 'lot', label: 'By lot', help: 'Slips drawn for each hive.' },
      { value: 'picked', label: 'The beekeeper picked', help: 'Strong hives were given the thick syrup.' },
    ],
  },
  hives: { id: 'hives', type: 'number', integer: true, min: 2, max: 400, text: 'How many hives took part?', help: 'Count hives, not frames or bees. For example 24 hives.' },
  note: { id: 'note', type: 'text', optional: true, text: 'Anything else about the apiary?', help: 'Free notes kept with the answers. For example "two hives were requeened in July".' },
};

export const ORDER = ['unit', 'layout', 'order', 'assignment', 'hives', 'note'];

export function applies(id: string, a: Answers): boolean {
  if (id === 'order') return a.layout === 'both-each-hive';
  if (id === 'assignment') return a.layout === 'one-each';
  return true;
}

/** Counts calls so tests can see that `next` was walked again after a change. */
export function hiveNext(a: Answers): Question | null {
  for (const id of ORDER) {
    if (!applies(id, a)) continue;
    if (!Object.prototype.hasOwnProperty.call(a, id)) return Q[id];
  }
  return null;
}

export const hiveRules = { questions: ORDER.map((id) => Q[id]) };
