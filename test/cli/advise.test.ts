/**
 * `tandem advise` through `run(argv, io)` with in-memory IO. The engine is replaced by a small
 * fake rule base (six questions, three outcomes built from the hand-made recommendations in
 * test/plan/recommendations.ts), so these tests check the command, not the rule base's wording.
 * The interactive path runs the real interview and save prompt on a scripted prompt adapter.
 */
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { run } from '../../src/cli/run.js';
import { CancelledError } from '../../src/errors.js';
import { readPlan } from '../../src/plan/index.js';
import type { Answers, Question, Recommendation } from '../../src/engine/types.js';
import type { PromptAdapter } from '../../src/interview/adapter.js';
import { memoryIO } from '../helpers/io.js';

const fake = vi.hoisted(() => {
  const questions: Question[] = [
    { id: 'unit', type: 'text', text: 'What is one measured unit?', help: 'e.g. a hive' },
    { id: 'outcome', type: 'text', text: 'What do you measure?', help: 'e.g. honey yield' },
    { id: 'first_label', type: 'text', text: 'Name the first condition.', help: '' },
    { id: 'second_label', type: 'text', text: 'Name the second condition.', help: '' },
    {
      id: 'arrangement',
      type: 'choice',
      text: 'How were the measurements arranged?',
      help: '',
      choices: [
        { value: 'split', label: 'each unit split in two', help: '' },
        { value: 'groups', label: 'separate randomized groups', help: '' },
        { value: 'four-dates', label: 'four dates on each unit', help: '' },
      ],
    },
    { id: 'outcome_unit', type: 'text', optional: true, text: 'Unit of the outcome?', help: '' },
  ];
  const script = {
    /** Answers by question id (matched on the question text), then file names and confirmations. */
    replies: new Map<string, string>(),
    confirms: [] as boolean[],
    asked: [] as string[],
    cancelAt: undefined as string | undefined,
  };
  return { questions, script };
});

vi.mock('../../src/engine/index.js', async () => {
  const recs = await import('../plan/recommendations.js');
  const rb = { questions: fake.questions, dir: 'fake' };
  const nextQuestion = (_rb: unknown, a: Answers): Question | null => fake.questions.find((q) => !(q.id in a)) ?? null;
  const classify = (_rb: unknown, a: Answers): Recommendation => {
    const make = a.arrangement === 'split' ? recs.splitLoaves : a.arrangement === 'groups' ? recs.hiveFeeds : recs.vineDates;
    const rec = make();
    rec.answers = { ...a };
    return rec;
  };
  return { loadRuleBase: () => rb, nextQuestion, classify };
});

vi.mock('../../src/interview/inquirer-adapter.js', () => ({
  inquirerAdapter: async (): Promise<PromptAdapter> => {
    const reply = (message: string): string => {
      fake.script.asked.push(message);
      if (fake.script.cancelAt && message.includes(fake.script.cancelAt)) throw new CancelledError();
      for (const [k, v] of fake.script.replies) if (message.includes(k)) return v;
      throw new Error(`unscripted prompt: ${message}`);
    };
    return {
      select: async (p) => reply(p.message),
      input: async (p) => reply(p.message),
      confirm: async (p) => {
        fake.script.asked.push(p.message);
        return fake.script.confirms.shift() ?? false;
      },
      say: () => undefined,
    };
  },
}));

const dir = (): string => mkdtempSync(join(tmpdir(), 'tandem-advise-'));

function answersFile(folder: string, answers: Record<string, string>, extra = ''): string {
  const path = join(folder, 'study.answers.yaml');
  writeFileSync(path, `format: tandem-answers/1\nanswers:\n${Object.entries(answers).map(([k, v]) => `  ${k}: ${JSON.stringify(v)}`).join('\n')}\n${extra}`);
  return path;
}

const BAKERY = { unit: 'dough piece', outcome: 'crust moisture', first_label: 'Oven A', second_label: 'Oven B', arrangement: 'split', outcome_unit: '%' };
const HIVES = { unit: 'hive', outcome: 'honey yield', first_label: 'Pollen patty', second_label: 'Sugar syrup', arrangement: 'groups', outcome_unit: 'kg' };
const VINES = { unit: 'vine', outcome: 'grape sugar', first_label: 'June', second_label: 'July', arrangement: 'four-dates', outcome_unit: '' };

beforeEach(() => {
  fake.script.replies.clear();
  fake.script.confirms = [];
  fake.script.asked = [];
  fake.script.cancelAt = undefined;
});

describe('tandem advise, answers from a file', () => {
  it('prints help with options and examples', async () => {
    const io = memoryIO();
    expect(await run(['advise', '--help'], io)).toBe(0);
    expect(io.out()).toMatch(/--answers FILE/);
    expect(io.out()).toMatch(/Examples:\n {2}tandem advise\n/);
  });

  it('prints the recommendation in our own sections and writes nothing', async () => {
    const d = dir();
    const io = memoryIO({ cwd: d });
    expect(await run(['advise', '--answers', answersFile(d, BAKERY)], io)).toBe(0);
    for (const h of ['DESIGN', 'WHY', 'PROCEDURE', 'SENSITIVITY ANALYSIS (DECLARED NOW)', 'HOW N AND DF ARE COUNTED', 'DIRECTION OF SUBTRACTION', 'HYPOTHESES', 'CONDITIONS TO CHECK', 'WHAT THE CONCLUSION MAY CLAIM', 'NEXT STEPS']) {
      expect(io.out()).toContain(`\n${h}\n`);
    }
    expect(io.out()).toMatch(/tandem advise --answers .*study\.answers\.yaml --plan plan\.yaml/);
    expect(existsSync(join(d, 'plan.yaml'))).toBe(false);
  });

  it('--json gives the recommendation fields and names the plan written with --plan', async () => {
    const d = dir();
    const io = memoryIO({ cwd: d });
    expect(await run(['advise', '--answers', answersFile(d, BAKERY), '--json', '--plan', 'loaves.plan.yaml'], io)).toBe(0);
    const out = JSON.parse(io.out());
    expect(out.design).toMatchObject({ family: 'paired', kind: 'split-units' });
    expect(out.procedure).toMatchObject({ id: 'paired-t', fallback: 'signed-rank' });
    for (const k of ['conditions', 'difference', 'hypotheses', 'scope', 'warnings', 'trace', 'answers']) expect(out).toHaveProperty(k);
    expect(out.planFile).toBe('loaves.plan.yaml');
    const plan = await readPlan(join(d, 'loaves.plan.yaml'));
    expect(plan.procedure.id).toBe('paired-t');
    expect(plan.study).toMatchObject({ first: 'Oven A', second: 'Oven B', outcomeUnit: '%' });
    expect(readFileSync(join(d, 'loaves.plan.yaml'), 'utf8').split('\n')[0]).toMatch(/^# yaml-language-server: \$schema=.*schemas\/plan-v1\.schema\.json$/);
  });

  it('uses --title, and the data block of the answers file, in the plan', async () => {
    const d = dir();
    const data = 'data:\n  layout: long\n  id: piece\n  condition: oven\n  value: moisture\n  firstLevel: A\n  secondLevel: B\n';
    const io = memoryIO({ cwd: d });
    expect(await run(['advise', '--answers', answersFile(d, BAKERY, data), '--plan', 'p.yaml', '--title', 'Deck oven trial'], io)).toBe(0);
    const plan = await readPlan(join(d, 'p.yaml'));
    expect(plan.title).toBe('Deck oven trial');
    expect(plan.data).toEqual({ layout: 'long', id: 'piece', condition: 'oven', value: 'moisture', firstLevel: 'A', secondLevel: 'B' });
    expect(io.err()).toMatch(/plan written to p\.yaml/);
  });

  it('refuses a data block that does not fit the design, and writes nothing', async () => {
    const d = dir();
    const io = memoryIO({ cwd: d });
    const data = 'data:\n  layout: groups\n  group: oven\n  value: moisture\n  firstLevel: A\n  secondLevel: B\n';
    expect(await run(['advise', '--answers', answersFile(d, BAKERY, data), '--plan', 'p.yaml'], io)).toBe(2);
    expect(io.err()).toMatch(/plan would not be valid, so p\.yaml was not written \(the data mapping comes from the answers file/);
    expect(io.err()).toMatch(/data layout 'groups' cannot be read by procedure 'paired-t'/);
    expect(existsSync(join(d, 'p.yaml'))).toBe(false);
  });

  it('refuses to replace an existing plan without --force, before doing anything else', async () => {
    const d = dir();
    writeFileSync(join(d, 'p.yaml'), 'mine\n');
    const io = memoryIO({ cwd: d });
    expect(await run(['advise', '--answers', 'no-such-file.yaml', '--plan', 'p.yaml'], io)).toBe(3);
    expect(io.err()).toMatch(/p\.yaml exists; nothing was written \(add --force/);
    expect(readFileSync(join(d, 'p.yaml'), 'utf8')).toBe('mine\n');
    const io2 = memoryIO({ cwd: d });
    expect(await run(['advise', '--answers', answersFile(d, HIVES), '--plan', 'p.yaml', '--force'], io2)).toBe(0);
    expect((await readPlan(join(d, 'p.yaml'))).procedure.id).toBe('welch-t');
  });

  it('--save-answers writes an answers file that gives the same result when read back', async () => {
    const d = dir();
    const io = memoryIO({ cwd: d });
    expect(await run(['advise', '--answers', answersFile(d, HIVES), '--save-answers', 'again.yaml', '--json'], io)).toBe(0);
    expect(JSON.parse(io.out()).answersFile).toBe('again.yaml');
    const io2 = memoryIO({ cwd: d });
    expect(await run(['advise', '--answers', 'again.yaml', '--json'], io2)).toBe(0);
    const a = JSON.parse(io.out());
    const b = JSON.parse(io2.out());
    delete a.answersFile;
    expect(b).toEqual(a);
  });

  it('without a terminal, lists the missing questions and writes nothing', async () => {
    const d = dir();
    const io = memoryIO({ cwd: d });
    const { first_label: _f, arrangement: _a, ...partial } = BAKERY;
    expect(await run(['advise', '--answers', answersFile(d, partial), '--plan', 'p.yaml'], io)).toBe(2);
    expect(io.err()).toMatch(/leaves questions unanswered, and there is no terminal/);
    expect(io.err()).toMatch(/- first_label: Name the first condition\./);
    expect(io.err()).toMatch(/- arrangement: How were the measurements arranged\? \(one of: split, groups, four-dates\)/);
    expect(existsSync(join(d, 'p.yaml'))).toBe(false);
  });

  it('without a terminal and without --answers, says how to give answers', async () => {
    const io = memoryIO();
    expect(await run(['advise'], io)).toBe(2);
    expect(io.err()).toMatch(/no answers: run tandem advise on a terminal.*--answers FILE/);
  });

  it('shows an answers-file problem at its line and column with a caret', async () => {
    const d = dir();
    const io = memoryIO({ cwd: d });
    const path = join(d, 'bad.yaml');
    writeFileSync(path, 'format: tandem-answers/1\nanswers:\n  unit: hive\n  arrangment: split\n');
    expect(await run(['advise', '--answers', 'bad.yaml'], io)).toBe(2);
    expect(io.err()).toMatch(/bad\.yaml:4:3: 'arrangment' is not a question/);
    expect(io.err()).toMatch(/4 \| {3}arrangment: split\n\s+\^/);
  });

  it('for a design outside a two-condition comparison, leads with what to do instead and writes no plan', async () => {
    const d = dir();
    const io = memoryIO({ cwd: d });
    expect(await run(['advise', '--answers', answersFile(d, VINES), '--plan', 'p.yaml'], io)).toBe(3);
    expect(io.out().split('\n')[2]).toBe('WHAT TO DO INSTEAD');
    expect(io.out()).toMatch(/repeated-measures model/);
    expect(io.out()).not.toMatch(/\nPROCEDURE\n/);
    expect(io.err()).toMatch(/no plan written to p\.yaml: more than two time points is outside a two-condition comparison/);
    expect(existsSync(join(d, 'p.yaml'))).toBe(false);
  });

  it('--markdown prints Markdown; --json with --markdown is refused', async () => {
    const d = dir();
    const io = memoryIO({ cwd: d });
    expect(await run(['advise', '--answers', answersFile(d, HIVES), '--markdown'], io)).toBe(0);
    expect(io.out()).toMatch(/^# Recommendation: Pollen patty versus Sugar syrup/);
    expect(io.out()).toMatch(/\n## Sensitivity analysis \(declared now\)\n/);
    const io2 = memoryIO({ cwd: d });
    expect(await run(['advise', '--answers', 'x.yaml', '--markdown', '--json'], io2)).toBe(2);
  });
});

describe('tandem advise on a terminal', () => {
  it('asks only what the answers file leaves open, then offers to save both files', async () => {
    const d = dir();
    const { outcome: _o, arrangement: _a, ...partial } = BAKERY;
    fake.script.replies.set('What do you measure?', 'crust moisture');
    fake.script.replies.set('How were the measurements arranged?', 'split');
    fake.script.replies.set('File name for your answers', 'kept.answers.yaml');
    fake.script.replies.set('File name for the analysis plan', 'kept.plan.yaml');
    fake.script.confirms = [true, true];
    const io = memoryIO({ cwd: d, interactive: true });
    expect(await run(['advise', '--answers', answersFile(d, partial)], io)).toBe(0);
    const questions = fake.script.asked.filter((m) => m.startsWith('(question'));
    expect(questions).toEqual(['(question 1) What do you measure?', '(question 2) How were the measurements arranged?']);
    expect(io.out()).toMatch(/\nPROCEDURE\n {2}paired t on the differences \[paired-t\]/);
    expect((await readPlan(join(d, 'kept.plan.yaml'))).study.outcome).toBe('crust moisture');
    expect(readFileSync(join(d, 'kept.answers.yaml'), 'utf8')).toMatch(/arrangement: split/);
  });

  it('runs the whole interview without --answers', async () => {
    const d = dir();
    for (const [k, v] of Object.entries({ 'measured unit': 'hive', 'What do you measure?': 'honey yield', 'first condition': 'Pollen patty', 'second condition': 'Sugar syrup', arranged: 'groups', 'Unit of the outcome': 'kg' })) fake.script.replies.set(k, v);
    fake.script.confirms = [false, false];
    const io = memoryIO({ cwd: d, interactive: true });
    expect(await run(['advise', '--json'], io)).toBe(0);
    expect(JSON.parse(io.out()).procedure.id).toBe('welch-t');
    expect(fake.script.asked.filter((m) => m.startsWith('(question'))).toHaveLength(6);
  });

  it('does not offer to save when --plan or --save-answers already chose the files', async () => {
    const d = dir();
    const { arrangement: _a, ...partial } = HIVES;
    fake.script.replies.set('arranged', 'groups');
    const io = memoryIO({ cwd: d, interactive: true });
    expect(await run(['advise', '--answers', answersFile(d, partial), '--plan', 'h.plan.yaml'], io)).toBe(0);
    expect(fake.script.asked.filter((m) => m.startsWith('Save'))).toEqual([]);
    expect((await readPlan(join(d, 'h.plan.yaml'))).procedure.id).toBe('welch-t');
  });

  it('for a design with no plan, offers and saves the answers only', async () => {
    const d = dir();
    const { arrangement: _a, ...partial } = VINES;
    fake.script.replies.set('arranged', 'four-dates');
    fake.script.replies.set('File name for your answers', 'vines.answers.yaml');
    fake.script.replies.set('File name for the analysis plan', 'vines.plan.yaml');
    fake.script.confirms = [true];
    const io = memoryIO({ cwd: d, interactive: true });
    expect(await run(['advise', '--answers', answersFile(d, partial)], io)).toBe(0);
    expect(existsSync(join(d, 'vines.answers.yaml'))).toBe(true);
    expect(existsSync(join(d, 'vines.plan.yaml'))).toBe(false);
    expect(io.err()).not.toMatch(/plan written/);
  });

  it('Ctrl-C leaves with exit 130 and writes nothing', async () => {
    const d = dir();
    fake.script.replies.set('What do you measure?', 'crust moisture');
    fake.script.cancelAt = 'How were the measurements arranged?';
    const { outcome: _o, arrangement: _a, ...partial } = BAKERY;
    const io = memoryIO({ cwd: d, interactive: true });
    expect(await run(['advise', '--answers', answersFile(d, partial), '--plan', 'p.yaml', '--save-answers', 'a.yaml'], io)).toBe(130);
    expect(io.err()).toMatch(/cancelled: nothing was written/);
    expect(existsSync(join(d, 'p.yaml'))).toBe(false);
    expect(existsSync(join(d, 'a.yaml'))).toBe(false);
    expect(io.out()).toBe('');
  });

  it('Ctrl-C at the save prompt writes nothing either', async () => {
    const d = dir();
    fake.script.cancelAt = 'File name for your answers';
    fake.script.confirms = [true];
    const io = memoryIO({ cwd: d, interactive: true });
    const { arrangement: _a, ...partial } = HIVES;
    fake.script.replies.set('arranged', 'groups');
    expect(await run(['advise', '--answers', answersFile(d, partial)], io)).toBe(130);
    expect(existsSync(join(d, 'pollen-patty-vs-sugar-syrup.answers.yaml'))).toBe(false);
  });
});
