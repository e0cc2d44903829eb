/**
 * The answers file (tandem-answers/1): every problem reported with line and column, all of them
 * together; writing then reading gives the same answers; the committed JSON Schema accepts what
 * tandem writes. Question set: the invented beekeeping questions of hives.ts.
 */
import fc from 'fast-check';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { Answers } from '../../src/engine/types.js';
import { InputError, OutputError } from '../../src/errors.js';
import {
  ANSWERS_FORMAT,
  answersToText,
  loadAnswersFile,
  parseAnswersText,
  writeAnswersFile,
} from '../../src/interview/answers-file.js';
import { schemasDir } from '../../src/paths.js';
import type { Problem } from '../../src/problems.js';
import { loadYaml } from '../../src/yaml/load.js';
import { validateLoaded } from '../../src/yaml/validate.js';
import { hiveRules } from './hives.js';

function problemsOf(text: string): Problem[] {
  try {
    parseAnswersText(text, 'trial.yaml', hiveRules);
  } catch (err) {
    expect(err).toBeInstanceOf(InputError);
    return (err as InputError).problems;
  }
  throw new Error('expected the answers file to be refused');
}

const pick = (p: Problem): Pick<Problem, 'code' | 'line' | 'col'> => ({ code: p.code, line: p.line, col: p.col });

describe('parseAnswersText', () => {
  it('reads answers, title and data', () => {
    const text = [
      '# yaml-language-server: $schema=../schemas/answers-v1.schema.json',
      'format: tandem-answers/1',
      'title: East apiary syrup trial',
      'answers:',
      '  # What is each measurement taken on?',
      '  unit: hive',
      '  layout: one-each  # Each hive got one syrup',
      '  hives: 18',
      '  note: ""',
      'data:',
      '  layout: groups',
      '  group: syrup',
      '  value: weight_gain_kg',
      '  firstLevel: thick',
      '  secondLevel: thin',
    ].join('\n');
    const r = parseAnswersText(text, 'trial.yaml', hiveRules);
    expect(r).toEqual({
      file: 'trial.yaml',
      title: 'East apiary syrup trial',
      answers: { unit: 'hive', layout: 'one-each', hives: 18, note: '' },
      data: { layout: 'groups', group: 'syrup', value: 'weight_gain_kg', firstLevel: 'thick', secondLevel: 'thin' },
    });
  });

  it('takes an empty answers mapping as no answers', () => {
    expect(parseAnswersText('format: tandem-answers/1\nanswers:\n', 'f.yaml', hiveRules).answers).toEqual({});
  });

  it('reports an unknown question id at its key, with a suggestion', () => {
    const ps = problemsOf('format: tandem-answers/1\nanswers:\n  unit: hive\n  layuot: one-each\n');
    expect(ps.map(pick)).toEqual([{ code: 'unknown-key', line: 4, col: 3 }]);
    expect(ps[0].file).toBe('trial.yaml');
    expect(ps[0].hint).toContain("did you mean 'layout'?");
  });

  it('reports a value outside the choice list at the value, with the allowed values', () => {
    const ps = problemsOf('format: tandem-answers/1\nanswers:\n  layout: every-other-week\n');
    expect(ps.map(pick)).toEqual([{ code: 'unknown-value', line: 3, col: 11 }]);
    expect(ps[0].hint).toBe('allowed: one of: both-each-hive, one-each');
  });

  it('reports numbers out of range, not whole, or not numbers', () => {
    const text = ['format: tandem-answers/1', 'answers:', '  hives: 1000', '  note: [a, b]'].join('\n');
    const ps = problemsOf(text);
    expect(ps.map(pick)).toEqual([
      { code: 'unknown-value', line: 3, col: 10 },
      { code: 'wrong-type', line: 4, col: 9 },
    ]);
    expect(ps[0].message).toContain('above the largest allowed value 400');
    expect(problemsOf('format: tandem-answers/1\nanswers:\n  hives: 2.5\n')[0].message).toContain('whole number');
    const quoted = problemsOf('format: tandem-answers/1\nanswers:\n  hives: "twelve"\n');
    expect(quoted.map(pick)).toEqual([{ code: 'wrong-type', line: 3, col: 10 }]);
    expect(quoted[0].hint).toBe('allowed: a whole number from 2 to 400');
  });

  it('collects every problem of the file and reports them together', () => {
    const text = ['format: tandem-answers/2', 'colour: blue', 'answers:', '  unit: ""', '  layout: maybe', '  frames: 3', '  hives: 1'].join('\n');
    const ps = problemsOf(text);
    expect(ps.map(pick)).toEqual([
      { code: 'unknown-key', line: 2, col: 1 },
      { code: 'format-version', line: 1, col: 9 },
      { code: 'wrong-type', line: 4, col: 9 },
      { code: 'unknown-value', line: 5, col: 11 },
      { code: 'unknown-key', line: 6, col: 3 },
      { code: 'unknown-value', line: 7, col: 10 },
    ]);
  });

  it('refuses a wrong or missing format line', () => {
    const wrong = problemsOf('format: tandem-plan/1\nanswers:\n  unit: hive\n');
    expect(wrong.map(pick)).toEqual([{ code: 'format-version', line: 1, col: 9 }]);
    expect(wrong[0].message).toContain(`this tandem reads ${ANSWERS_FORMAT}`);
    expect(problemsOf('answers:\n  unit: hive\n').map((p) => p.code)).toEqual(['missing-key']);
    expect(problemsOf('- unit\n- hive\n').map((p) => p.code)).toEqual(['wrong-type']);
  });

  it('refuses keys that could reach an object prototype, and duplicate keys', () => {
    const proto = problemsOf('format: tandem-answers/1\nanswers:\n  __proto__: { polluted: true }\n');
    expect(proto.map(pick)).toEqual([{ code: 'unknown-key', line: 3, col: 3 }]);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    const dup = problemsOf('format: tandem-answers/1\nanswers:\n  unit: hive\n  unit: frame\n');
    expect(dup[0].code).toBe('yaml-syntax');
    expect(dup[0].line).toBe(4);
  });

  it('reports YAML syntax errors with their position', () => {
    const ps = problemsOf('format: tandem-answers/1\nanswers:\n  unit: "hive\n');
    expect(ps[0].code).toBe('yaml-syntax');
    expect(ps[0].line).toBeGreaterThanOrEqual(3);
  });

  it('takes a number or yes/no written for a text answer as its text', () => {
    const r = parseAnswersText('format: tandem-answers/1\nanswers:\n  unit: 2024\n', 'f.yaml', hiveRules);
    expect(r.answers.unit).toBe('2024');
  });
});

describe('answersToText', () => {
  const answers: Answers = { unit: 'hive', layout: 'both-each-hive', order: 'yes', hives: 24, note: '' };

  it('writes the modeline first, and each answer after a comment with its question', () => {
    const text = answersToText(answers, hiveRules, { title: 'Syrup trial', schemaRef: '../schemas/answers-v1.schema.json' });
    const lines = text.split('\n');
    expect(lines[0]).toBe('# yaml-language-server: $schema=../schemas/answers-v1.schema.json');
    expect(text).toContain('format: tandem-answers/1\n');
    expect(text).toContain('  # What is each measurement taken on?\n  unit: hive\n');
    expect(text).toContain('  # How did the two syrups reach the hives?\n  # one of: both-each-hive, one-each\n  layout: both-each-hive # Each hive got both syrups, one after the other\n');
    expect(text).toContain('  note: ""\n');
  });

  it('writes answers in the rule base order', () => {
    const text = answersToText({ note: 'x', hives: 3, unit: 'hive' }, hiveRules);
    expect(text.indexOf('unit:')).toBeLessThan(text.indexOf('hives:'));
    expect(text.indexOf('hives:')).toBeLessThan(text.indexOf('note:'));
  });

  it('refuses answers to questions the rule base does not have', () => {
    expect(() => answersToText({ wax: 'yellow' }, hiveRules)).toThrow(/unknown questions cannot be written: wax/);
  });

  it('round trip: reading what was written gives the same answers, title and data', () => {
    const data = { layout: 'wide', first: 'thick_kg', second: 'thin_kg', id: 'hive_no', pairBy: 'id' };
    const text = answersToText(answers, hiveRules, { title: 'Syrup trial: "east" apiary # 2', data });
    expect(parseAnswersText(text, 'f.yaml', hiveRules)).toEqual({ file: 'f.yaml', answers, title: 'Syrup trial: "east" apiary # 2', data });
  });

  it('round trip holds for any valid answers (property test)', () => {
    const textArb = fc.string({ minLength: 1, maxLength: 60 }).filter((s) => s.trim() === s && s !== '' && s.length <= 500);
    const arb = fc.record({
      unit: textArb,
      layout: fc.constantFrom('both-each-hive', 'one-each'),
      hives: fc.integer({ min: 2, max: 400 }),
      note: fc.oneof(fc.constant(''), textArb),
    });
    fc.assert(
      fc.property(arb, fc.option(textArb, { nil: undefined }), (a, title) => {
        const text = answersToText(a, hiveRules, { title });
        const back = parseAnswersText(text, 'p.yaml', hiveRules);
        expect(back.answers).toEqual(a);
        expect(back.title).toBe(title);
      }),
      { numRuns: 200 },
    );
  });

  it('writes files that the committed JSON Schema accepts; the schema refuses a wrong format', () => {
    const schema = JSON.parse(readFileSync(join(schemasDir(), 'answers-v1.schema.json'), 'utf8')) as object;
    const text = answersToText(answers, hiveRules, { title: 't', data: { layout: 'columns', first: 'a', second: 'b' } });
    expect(validateLoaded(loadYaml(text, 'ok.yaml'), schema)).toEqual([]);
    const bad = validateLoaded(loadYaml('format: tandem-answers/9\nanswers: {}\n', 'bad.yaml'), schema);
    expect(bad.map((p) => [p.line, p.col])).toEqual([[1, 9]]);
  });
});

describe('files on disk', () => {
  it('writes with a modeline that points at the schema, refuses to overwrite, and loads back', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'tandem-answers-'));
    const path = join(dir, 'syrup.yaml');
    const answers: Answers = { unit: 'hive', layout: 'one-each', assignment: 'lot', hives: 11, note: '' };
    await writeAnswersFile(path, answers, hiveRules, { title: 'Syrup trial' });
    const text = readFileSync(path, 'utf8');
    const ref = /\$schema=(.+)\n/.exec(text)?.[1] ?? '';
    expect(existsSync(resolve(dirname(path), ref))).toBe(true);
    expect(loadAnswersFile(path, hiveRules)).toEqual({ file: path, answers, title: 'Syrup trial' });
    await expect(writeAnswersFile(path, answers, hiveRules)).rejects.toBeInstanceOf(OutputError);
    writeFileSync(path, 'kept');
    await writeAnswersFile(path, answers, hiveRules, { force: true });
    expect(readFileSync(path, 'utf8')).toContain('format: tandem-answers/1');
  });

  it('a missing file is bad input, not a crash', () => {
    expect(() => loadAnswersFile('/nonexistent/answers.yaml', hiveRules)).toThrow(InputError);
    expect(() => loadAnswersFile('/nonexistent/answers.yaml', hiveRules)).toThrow(/no such file/);
  });
});
