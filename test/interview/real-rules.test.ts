/**
 * The interview over the real rule base (rules/*.yaml), skipped while the engine or the rule base
 * cannot be loaded (so this area's tests do not fail for another area's work in progress).
 * Many answer paths are walked with a scripted adapter (choices drawn by a seeded generator), each
 * must end with answers that classify; one path is started through the real prompts and
 * cancelled; the answers-file round trip is checked on real questions.
 */
import { describe, expect, it } from 'vitest';
import type { Answers, Question, RuleBaseView } from '../../src/engine/types.js';
import { CancelledError } from '../../src/errors.js';
import type { PromptAdapter } from '../../src/interview/adapter.js';
import { answersToText, parseAnswersText } from '../../src/interview/answers-file.js';
import { runInterview } from '../../src/interview/interview.js';
import { missingAnswers } from '../../src/interview/walk.js';
import { memoryIO } from '../helpers/io.js';
import { KEY, terminal } from './terminal.js';

interface Engine {
  rb: RuleBaseView;
  next: (a: Answers) => Question | null;
  classify: (a: Answers) => { design: { family: string } };
}

async function loadEngine(): Promise<Engine | null> {
  try {
    const engine = (await import('../../src/engine/index.js')) as Record<string, unknown>;
    if (typeof engine.loadRuleBase !== 'function' || typeof engine.nextQuestion !== 'function' || typeof engine.classify !== 'function') return null;
    const rb = (engine.loadRuleBase as () => RuleBaseView)();
    const nq = engine.nextQuestion as (rb: RuleBaseView, a: Answers) => Question | null;
    const cl = engine.classify as (rb: RuleBaseView, a: Answers) => { design: { family: string } };
    return { rb, next: (a) => nq(rb, a), classify: (a) => cl(rb, a) };
  } catch {
    return null;
  }
}

const engine = await loadEngine();

/** A small seeded generator (mulberry32), so every run walks the same paths. */
function seeded(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Answers whatever is asked: a choice drawn by the seeded generator, a number in range, some text. */
function autoAnswer(current: () => Question, seed: number): PromptAdapter {
  let calls = 0;
  const random = seeded(seed);
  const choose = (): string => {
    const q = current();
    calls++;
    if (q.type === 'choice') {
      const cs = q.choices ?? [];
      return cs[Math.floor(random() * cs.length)].value;
    }
    if (q.type === 'number') {
      if (q.optional && (seed + calls) % 3 === 0) return '';
      const lo = q.min ?? 0;
      const hi = q.max ?? lo + 400;
      const v = q.integer ? Math.ceil((lo + hi) / 2) : (lo + hi) / 2;
      return String(v === lo && q.minExclusive ? v + 1 : v);
    }
    if (q.optional && (seed + calls) % 2 === 0) return '';
    return ['east terrace', 'thin syrup', 'thick syrup', 'frame weight'][calls % 4];
  };
  return {
    select: async () => choose(),
    input: async (p) => {
      const typed = choose();
      const ok = p.validate ? p.validate(typed) : true;
      if (ok !== true) throw new Error(`auto answer '${typed}' refused for ${current().id}: ${ok}`);
      return typed;
    },
    confirm: async () => false,
    say: () => undefined,
  };
}

describe.skipIf(engine === null)('interview over the real rule base', () => {
  const e = engine as Engine;

  it('every question can be shown by the prompt layer', () => {
    for (const q of e.rb.questions) {
      expect(q.text.trim(), q.id).not.toBe('');
      if (q.type === 'choice') {
        expect((q.choices ?? []).length, q.id).toBeGreaterThan(0);
        for (const c of q.choices ?? []) expect(c.value.startsWith('\u0001'), `${q.id}.${c.value}`).toBe(false);
      }
    }
  });

  it('walks many answer paths to answers that classify', async () => {
    const families = new Set<string>();
    for (let seed = 0; seed < 40; seed++) {
      let last: Question | null = null;
      const next = (a: Answers): Question | null => (last = e.next(a));
      const answers = await runInterview({ next, io: memoryIO(), ask: autoAnswer(() => last as Question, seed) });
      expect(missingAnswers(e.next, answers), `seed ${seed}`).toEqual([]);
      let family: string;
      try {
        family = e.classify(answers).design.family;
      } catch (err) {
        throw new Error(`seed ${seed}: ${(err as Error).message}\nanswers: ${JSON.stringify(answers)}`);
      }
      families.add(family);
      // The answers file holds exactly these answers.
      expect(parseAnswersText(answersToText(answers, e.rb), 'real.yaml', e.rb).answers, `seed ${seed}`).toEqual(answers);
    }
    expect([...families].sort()).toEqual(['independent', 'other', 'paired']);
  });

  it('starts through the real prompts and cancels cleanly', async () => {
    const t = terminal();
    const done = runInterview({ next: e.next, io: t.io }).then((v) => v, (err: Error) => err);
    const first = e.next({}) as Question;
    await t.waitFor(`(question 1) ${first.text}`);
    if (first.type === 'choice') t.type(KEY.enter);
    else t.type(first.type === 'number' ? String(first.min ?? 1) : 'test tile', KEY.enter);
    await t.waitFor('(question 2)');
    t.type(KEY.ctrlC);
    expect(await done).toBeInstanceOf(CancelledError);
  });
});
