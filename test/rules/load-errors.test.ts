/**
 * Loading the rule base: every kind of bad rule file gives a problem with file, line and column,
 * all problems of a load are reported together, and nothing is silently skipped.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, test } from 'vitest';
import { InputError } from '../../src/errors.js';
import { loadRuleBase, readRuleBase } from '../../src/engine/index.js';
import type { Problem } from '../../src/problems.js';
import { lineOf, TINY, writeRules } from './tiny-rules.js';

function problemsOf(files: Record<string, string>): Problem[] {
  return readRuleBase(writeRules(files)).problems;
}

function only(ps: Problem[], code: Problem['code']): Problem {
  const hits = ps.filter((p) => p.code === code);
  expect(hits, JSON.stringify(ps, null, 1)).toHaveLength(1);
  return hits[0];
}

describe('loading rule files', () => {
  test('the tiny rule base loads cleanly', () => {
    const rb = loadRuleBase(writeRules());
    expect(rb.questions.map((q) => q.id)).toEqual(['unit', 'first_label', 'second_label', 'layout', 'size', 'direction']);
    expect(rb.files).toHaveLength(4);
  });

  test('malformed YAML is reported with line and column', () => {
    const text = 'questions:\n  - id: unit\n    text: [unclosed\n';
    const p = problemsOf({ 'questions.yaml': text })[0];
    expect(p.code).toBe('yaml-syntax');
    expect(p.file).toMatch(/questions\.yaml$/);
    expect(p.line).toBeGreaterThanOrEqual(3);
    expect(p.col).toBeGreaterThan(0);
  });

  test('an unknown key is reported at the key', () => {
    const text = TINY['designs.yaml'].replace('    design: staves\n', '    design: staves\n    weight: 3\n');
    const p = only(problemsOf({ 'designs.yaml': text }), 'unknown-key');
    expect(p.message).toContain("unknown key 'weight'");
    expect(p.line).toBe(lineOf(text, 'weight: 3'));
    expect(p.col).toBe(5);
  });

  test('a wrong type is reported at the value', () => {
    const text = TINY['questions.yaml'].replace('    integer: true\n', '    integer: yes please\n');
    const p = problemsOf({ 'questions.yaml': text }).find((x) => x.code === 'wrong-type');
    expect(p?.line).toBe(lineOf(text, 'integer: yes please'));
    expect(p?.col).toBe(14);
  });

  test('duplicate ids are reported, also across files, pointing at the first definition', () => {
    const extra = `rules:\n  - id: rule-staves\n    when: { fact: layout, equals: same }\n    design: staves\n    reasons: [again]\n`;
    const p = only(problemsOf({ 'more.yaml': extra }), 'duplicate-id');
    expect(p.file).toMatch(/more\.yaml$/);
    expect(p.line).toBe(2);
    expect(p.hint).toMatch(/first defined at .*designs\.yaml:\d+:\d+/);
  });

  test('duplicate choice values within a question are reported', () => {
    const text = TINY['questions.yaml'].replace('{ value: different,', '{ value: same,');
    const p = only(problemsOf({ 'questions.yaml': text }), 'duplicate-id');
    expect(p.message).toContain("lists the choice 'same' twice");
  });

  test('dangling references: design, predicate, fact, condition, procedure', () => {
    const designs = TINY['designs.yaml'].replace('design: barrels', 'design: casks').replace('{ fact: layout, equals: same }', '{ ref: same-barrel }');
    const procs = TINY['procedures.yaml'].replace('conditions: [shape]', 'conditions: [shapely]').replace('fallback: paired-t', 'fallback: rank-sum');
    const stmts = TINY['statements.yaml'].replace('{ fact: size, lt: 6 }', '{ fact: barrel_count, lt: 6 }');
    const ps = problemsOf({ 'designs.yaml': designs, 'procedures.yaml': procs, 'statements.yaml': stmts });
    const messages = ps.filter((p) => p.code === 'dangling-ref').map((p) => p.message);
    expect(messages.some((m) => m.includes("unknown design 'casks'"))).toBe(true);
    expect(messages.some((m) => m.includes("unknown predicate 'same-barrel'"))).toBe(true);
    expect(messages.some((m) => m.includes("unknown fact 'barrel_count'"))).toBe(true);
    expect(messages.some((m) => m.includes("unknown condition 'shapely'"))).toBe(true);
    expect(messages.some((m) => m.includes("'rank-sum' is not a procedure in the catalogue"))).toBe(true);
    const fact = ps.find((p) => p.message.includes('barrel_count'))!;
    expect(fact.line).toBe(lineOf(stmts, 'barrel_count'));
    expect(fact.col).toBe(stmts.split('\n')[fact.line! - 1].indexOf('barrel_count') + 1);
  });

  test('an unknown operator is reported at its key, with the allowed operators', () => {
    const text = TINY['designs.yaml'].replace('{ fact: layout, equals: same }', '{ fact: layout, resembles: same }');
    const p = only(problemsOf({ 'designs.yaml': text }), 'unknown-operator');
    expect(p.message).toContain("unknown operator 'resembles'");
    expect(p.hint).toContain('equals, in, answered, gt, gte, lt, lte');
    expect(p.line).toBe(lineOf(text, 'resembles'));
    expect(p.col).toBe(text.split('\n')[p.line! - 1].indexOf('resembles') + 1);
  });

  test('an unknown combining operator (e.g. eval) is refused', () => {
    const text = TINY['designs.yaml'].replace('{ fact: layout, equals: same }', "{ eval: 'layout == same' }");
    const p = only(problemsOf({ 'designs.yaml': text }), 'unknown-operator');
    expect(p.message).toContain("unknown operator 'eval'");
  });

  test('a choice compared with a value it does not offer is reported', () => {
    const text = TINY['designs.yaml'].replace('{ fact: layout, equals: same }', '{ fact: layout, equals: identical }');
    const p = only(problemsOf({ 'designs.yaml': text }), 'unknown-value');
    expect(p.message).toContain("'identical' is not a value of 'layout'");
    expect(p.hint).toBe('allowed: same, different');
  });

  test('numeric operators need a number question', () => {
    const text = TINY['statements.yaml'].replace('{ fact: size, lt: 6 }', '{ fact: layout, lt: 6 }');
    const p = only(problemsOf({ 'statements.yaml': text }), 'wrong-type');
    expect(p.message).toContain("'layout' is not a number question");
  });

  test('a question guard may not read a later question, nor the design', () => {
    const q = TINY['questions.yaml'].replace('ask_when: { fact: layout, equals: same }', 'ask_when: { fact: direction, equals: first-higher }');
    const p = only(problemsOf({ 'questions.yaml': q }), 'dangling-ref');
    expect(p.message).toContain("reads 'direction', which is asked later");
    const q2 = TINY['questions.yaml'].replace('ask_when: { fact: layout, equals: same }', 'ask_when: { fact: design_family, equals: paired }');
    expect(only(problemsOf({ 'questions.yaml': q2 }), 'dangling-ref').message).toContain('not known yet');
  });

  test('unknown placeholders in texts are reported', () => {
    const text = TINY['statements.yaml'].replace('Only {size} barrels.', 'Only {barrels} barrels.');
    const p = only(problemsOf({ 'statements.yaml': text }), 'dangling-ref');
    expect(p.message).toContain("unknown placeholder '{barrels}'");
    expect(p.line).toBe(lineOf(text, 'Only {barrels}'));
  });

  test('a question may name only an earlier answer in its text, and only with a default', () => {
    const ok = TINY['questions.yaml'].replace('text: Same barrel or different barrels?', 'text: "Were {first_label|the first} and {second_label|the second} on the same barrel?"');
    expect(problemsOf({ 'questions.yaml': ok })).toEqual([]);
    const later = TINY['questions.yaml'].replace('text: Same barrel or different barrels?', 'text: "Same barrel, for {direction|the aim}?"');
    const p = only(problemsOf({ 'questions.yaml': later }), 'dangling-ref');
    expect(p.message).toContain("placeholder '{direction}' in a question must name an earlier question and give a default");
    expect(p.line).toBe(lineOf(later, 'Same barrel, for'));
    const noDefault = TINY['questions.yaml'].replace('text: Same barrel or different barrels?', 'text: "Same barrel for {first_label}?"');
    expect(only(problemsOf({ 'questions.yaml': noDefault }), 'dangling-ref').message).toContain("'{first_label}'");
  });

  test('an unknown procedure id in the catalogue is reported with the allowed ids', () => {
    const text = TINY['procedures.yaml'].replace('  - id: welch-t\n', '  - id: welsh-t\n');
    const ps = problemsOf({ 'procedures.yaml': text });
    const p = ps.find((x) => x.code === 'unknown-value')!;
    expect(p.message).toContain("unknown procedure id 'welsh-t'");
    expect(p.hint).toContain('welch-t');
  });

  test('problems of several files are reported together', () => {
    const ps = problemsOf({
      'designs.yaml': TINY['designs.yaml'].replace('    design: staves\n', '    design: staves\n    weight: 3\n'),
      'statements.yaml': 'differences: [\n',
    });
    expect(new Set(ps.map((p) => p.file?.split('/').pop()))).toEqual(new Set(['designs.yaml', 'statements.yaml']));
  });

  test('__proto__ and constructor keys are refused and cannot pollute objects', () => {
    const text = `questions:\n  - id: unit\n    type: text\n    text: x\n    help: y\n    __proto__: { polluted: true }\n`;
    const p = only(problemsOf({ 'questions.yaml': text }), 'unknown-key');
    expect(p.message).toContain("'__proto__'");
    expect(p.line).toBe(6);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    const t2 = `designs:\n  - kind: x\n    family: paired\n    label: l\n    description: d\n    constructor: 1\n`;
    expect(only(problemsOf({ 'extra.yaml': t2 }), 'unknown-key').line).toBe(6);
  });

  test('an alias bomb is stopped (alias expansion is bounded)', () => {
    const lines = ['a0: &a0 [x, x, x, x, x, x, x, x, x, x]'];
    for (let i = 1; i <= 8; i++) lines.push(`a${i}: &a${i} [${Array(10).fill(`*a${i - 1}`).join(', ')}]`);
    const ps = problemsOf({ 'bomb.yaml': lines.join('\n') + '\n' });
    expect(ps).toHaveLength(1);
    expect(ps[0].file).toMatch(/bomb\.yaml$/);
    expect(ps[0].message).toMatch(/alias/i);
  });

  test('loadRuleBase throws InputError carrying every problem', () => {
    const dir = writeRules({ 'designs.yaml': TINY['designs.yaml'].replace('design: barrels', 'design: casks') });
    try {
      loadRuleBase(dir);
      expect.unreachable();
    } catch (err) {
      expect(err).toBeInstanceOf(InputError);
      expect((err as InputError).problems.length).toBeGreaterThan(0);
      expect((err as InputError).message).toMatch(/has \d+ problems?/);
    }
  });

  test('a missing or empty directory is an InputError (nothing to check)', () => {
    expect(() => readRuleBase(join(tmpdir(), 'tandem-no-such-dir-9f3a'))).toThrow(/does not exist/);
    const empty = mkdtempSync(join(tmpdir(), 'tandem-empty-'));
    expect(() => readRuleBase(empty)).toThrow(/holds no \.yaml files/);
    writeFileSync(join(empty, 'notes.txt'), 'x');
    expect(() => readRuleBase(empty)).toThrow(/holds no \.yaml files/);
  });
});
