import { describe, expect, it } from 'vitest';
import { Ajv } from 'ajv';
import { checkPlanText, parsePlanText, planFromRecommendation, planSchema, writePlanText } from '../../src/plan/index.js';
import { InputError } from '../../src/errors.js';
import { formatProblem } from '../../src/problems.js';
import { coldBoxes, hiveFeeds, splitLoaves } from './recommendations.js';

const valid = (make = splitLoaves): string => writePlanText(planFromRecommendation(make()), 'plan.yaml');

/** 1-based line and column of the first occurrence of `needle` in `text`. */
function where(text: string, needle: string, offset = 0): { line: number; col: number } {
  const lines = text.split('\n');
  const i = lines.findIndex((l) => l.includes(needle));
  if (i < 0) throw new Error(`'${needle}' not in the text`);
  return { line: i + 1, col: lines[i].indexOf(needle) + 1 + offset };
}

describe('the schema file', () => {
  it('compiles under ajv strict mode (no unknown keywords; type unions as draft-07 allows)', () => {
    expect(() => new Ajv({ strict: true, allowUnionTypes: true, allErrors: true }).compile(planSchema())).not.toThrow();
  });
});

describe('plan check: schema problems with line and column', () => {
  it('accepts a plan as written', () => {
    expect(checkPlanText(valid(), 'plan.yaml').problems).toEqual([]);
  });

  it('places an unknown key at the key', () => {
    const text = valid().replace('  nullValue: 0', '  nullValue: 0\n  tails: 2');
    const { problems } = checkPlanText(text, 'plan.yaml');
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatchObject({ code: 'unknown-key', file: 'plan.yaml', ...where(text, 'tails') });
    expect(problems[0].message).toMatch(/unknown key 'tails' in procedure/);
  });

  it('names the allowed procedure ids at the bad value', () => {
    const text = valid().replace('id: paired-t', 'id: paired-z');
    const [p] = checkPlanText(text, 'plan.yaml').problems;
    expect(p).toMatchObject({ code: 'unknown-value', ...where(text, 'paired-z') });
    expect(p.hint).toMatch(/"paired-t", "welch-t"/);
    expect(formatProblem(p, text)).toMatch(/\n {2}\d+ \| {3}id: paired-z\n {2}\s+\^$/);
  });

  it('reports a confidence level outside (0, 1) and a string where a number belongs, together', () => {
    const text = valid().replace('confidence: 0.95', 'confidence: 95').replace('nullValue: 0', 'nullValue: zero');
    const problems = checkPlanText(text, 'plan.yaml').problems;
    expect(problems.map((p) => [p.line, p.code])).toEqual([
      [where(text, 'confidence: 95').line, 'schema'],
      [where(text, 'nullValue: zero').line, 'wrong-type'],
    ]);
    expect(problems[0].message).toMatch(/procedure\.confidence must be < 1/);
  });

  it('reports a missing section at the top level', () => {
    const text = valid().replace(/^difference: .*\n/m, '');
    const [p] = checkPlanText(text, 'plan.yaml').problems;
    expect(p).toMatchObject({ code: 'missing-key' });
    expect(p.message).toMatch(/missing the required key 'difference'/);
  });

  it('checks the data section against its layout, without noise from the schema branches', () => {
    const text = valid(hiveFeeds).replace('  group: group', '  group: group\n  pairBy: id').replace(/ {2}firstLevel: .*\n/, '');
    const problems = checkPlanText(text, 'plan.yaml').problems;
    expect(problems.map((p) => p.message)).toEqual([
      "data is missing the required key 'firstLevel'",
      "unknown key 'pairBy' in data",
    ]);
    expect(problems[1]).toMatchObject(where(text, 'pairBy'));
  });

  it('reports an unknown layout with the allowed ones', () => {
    const text = valid().replace('layout: wide', 'layout: sideways');
    const problems = checkPlanText(text, 'plan.yaml').problems;
    expect(problems).toHaveLength(1);
    expect(problems[0].hint).toMatch(/"wide", "long", "groups", "columns", "crossover"/);
  });

  it('reports YAML syntax errors with their position and no schema noise', () => {
    const text = valid().replace('  id: paired-t', '  id: [paired-t');
    const problems = checkPlanText(text, 'plan.yaml').problems;
    expect(problems.length).toBeGreaterThan(0);
    expect(problems.every((p) => p.code === 'yaml-syntax' && p.line !== undefined)).toBe(true);
  });

  it('refuses keys that could reach an object prototype', () => {
    const text = valid().replace('answers:\n', 'answers:\n  __proto__: x\n');
    expect(checkPlanText(text, 'plan.yaml').problems[0]).toMatchObject({ code: 'unknown-key', ...where(text, '__proto__') });
  });
});

describe('plan check: the format version', () => {
  it('gives one clear message for a plan from a newer tandem', () => {
    const text = valid().replace('format: tandem-plan/1', 'format: tandem-plan/2').replace('  nullValue: 0', '  nullValue: 0\n  newThing: yes');
    const problems = checkPlanText(text, 'plan.yaml').problems;
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatchObject({ code: 'format-version', ...where(text, 'tandem-plan/2') });
    expect(problems[0].message).toMatch(/format tandem-plan\/2, written by a newer tandem; tandem .* reads tandem-plan\/1/);
    expect(problems[0].hint).toMatch(/upgrade tandem/);
  });

  it('says when a file is not a tandem plan at all', () => {
    const [p] = checkPlanText('format: tandem-answers/1\nanswers: {}\n', 'a.yaml').problems;
    expect(p).toMatchObject({ code: 'format-version', line: 1, col: 9 });
    expect(p.message).toMatch(/not a tandem plan/);
  });

  it('handles an empty file and a list at the top', () => {
    expect(checkPlanText('', 'e.yaml').problems[0].message).toMatch(/empty/);
    expect(checkPlanText('- a\n- b\n', 'l.yaml').problems[0].message).toMatch(/not a list/);
  });
});

describe('plan check: the parts must agree', () => {
  const one = (text: string): ReturnType<typeof checkPlanText>['problems'] => checkPlanText(text, 'plan.yaml').problems;

  it('a procedure must fit the design family', () => {
    const text = valid().replace('id: paired-t', 'id: welch-t').replace('id: signed-rank', 'id: rank-sum');
    const problems = one(text);
    expect(problems[0]).toMatchObject({ ...where(text, 'welch-t') });
    expect(problems[0].message).toMatch(/'welch-t' is for independent designs, but design.family is 'paired'/);
    expect(problems[0].hint).toMatch(/paired-t, signed-rank, mcnemar/);
  });

  it('an equivalence procedure needs a margin; other procedures take none', () => {
    const noMargin = valid(coldBoxes).replace(/ {2}margin: 0.5\n/, '');
    expect(one(noMargin)[0].message).toMatch(/equivalence test and needs procedure.margin/);
    const stray = valid().replace('  nullValue: 0', '  nullValue: 0\n  margin: 2');
    expect(one(stray)[0]).toMatchObject({ code: 'unknown-key', ...where(stray, 'margin: 2') });
    expect(one(stray)[0].message).toMatch(/only used for an equivalence aim: by the equivalence procedures/);
  });

  it('the sensitivity analysis must fit the main procedure', () => {
    const text = valid().replace('id: signed-rank', 'id: rank-sum');
    const [p] = one(text);
    expect(p).toMatchObject(where(text, 'rank-sum'));
    expect(p.hint).toMatch(/allowed: signed-rank/);
    const same = valid().replace('id: signed-rank', 'id: paired-t');
    expect(one(same)[0].message).toMatch(/repeats the main procedure/);
  });

  it('the data layout must be readable by the procedure, and columns must differ', () => {
    const text = valid().replace('  second: oven_b', '  second: oven_a');
    expect(one(text)[0]).toMatchObject({ ...where(text, 'second: oven_a', 8) });
    expect(one(text)[0].message).toMatch(/name the same column 'oven_a'/);
    const layout = valid(hiveFeeds).replace('layout: groups', 'layout: columns').replace(/ {2}group: group\n {2}value: honey_yield\n {2}firstLevel: .*\n {2}secondLevel: .*\n/, '  first: a\n  second: b\n');
    expect(one(layout)).toEqual([]);
  });

  it('an event value belongs to binary procedures only', () => {
    const text = valid().replace('  second: Oven B', '  second: Oven B\n  event: burnt');
    expect(one(text)[0]).toMatchObject({ code: 'unknown-key', ...where(text, 'event: burnt') });
  });

  it('pairing by id needs the id column', () => {
    const text = valid().replace(/ {2}id: id\n/, '');
    expect(one(text)[0].message).toMatch(/pairBy is id but data.id/);
  });

  it('the missing-data policy must fit the design', () => {
    const text = valid().replace('missingPolicy: drop-incomplete-pairs', 'missingPolicy: drop-missing-values');
    expect(one(text)[0]).toMatchObject({ ...where(text, 'missingPolicy: drop-missing-values', 15) });
  });

  it('parsePlanText throws InputError carrying every problem', () => {
    const text = valid().replace('id: paired-t', 'id: welch-t').replace('missingPolicy: drop-incomplete-pairs', 'missingPolicy: drop-missing-values');
    try {
      parsePlanText(text, 'plan.yaml');
      expect.unreachable();
    } catch (err) {
      expect(err).toBeInstanceOf(InputError);
      expect((err as InputError).message).toMatch(/plan.yaml is not a valid tandem-plan\/1 plan \(\d+ problems\)/);
      expect((err as InputError).problems.length).toBeGreaterThanOrEqual(2);
    }
  });
});
