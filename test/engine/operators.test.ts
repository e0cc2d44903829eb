/**
 * The closed operator vocabulary: each leaf operator on given, missing and blank facts; all, any,
 * not and ref; and the trace each evaluation leaves (fact, operator, expected, actual, result).
 * Facts are invented (a kiln-firing study).
 */
import { describe, expect, test } from 'vitest';
import { evaluate, LEAF, type Facts } from '../../src/engine/conditions.js';
import { LEAF_OPERATORS, type Condition, type PredicateDef } from '../../src/engine/model.js';
import type { TraceStep } from '../../src/engine/types.js';

const pos = { file: 't.yaml', line: 1, col: 1 };
const leaf = (fact: string, op: (typeof LEAF_OPERATORS)[number], value: unknown): Condition => ({ op, fact, value, pos });
const facts: Facts = new Map<string, string | number | boolean>([
  ['glaze', 'ash'],
  ['loads', 12],
  ['note', ''],
]);
const preds = new Map<string, PredicateDef>([
  ['ash-glaze', { id: 'ash-glaze', description: 'ash', when: leaf('glaze', 'equals', 'ash'), pos }],
]);
const ev = (c: Condition, trace?: TraceStep[]) => evaluate(c, facts, { predicates: preds, rule: 'r', trace });

describe('leaf operators', () => {
  test('the vocabulary is closed and each operator has an implementation', () => {
    expect([...LEAF_OPERATORS].sort()).toEqual(Object.keys(LEAF).sort());
  });

  test.each([
    ['equals', 'glaze', 'ash', true],
    ['equals', 'glaze', 'salt', false],
    ['in', 'glaze', ['salt', 'ash'], true],
    ['in', 'glaze', ['salt'], false],
    ['gt', 'loads', 11, true],
    ['gt', 'loads', 12, false],
    ['gte', 'loads', 12, true],
    ['gte', 'loads', 13, false],
    ['lt', 'loads', 13, true],
    ['lt', 'loads', 12, false],
    ['lte', 'loads', 12, true],
    ['lte', 'loads', 11, false],
    ['answered', 'glaze', true, true],
    ['answered', 'glaze', false, false],
  ] as const)('%s on %s with %j is %s', (op, fact, value, expected) => {
    expect(ev(leaf(fact, op, value))).toBe(expected);
  });

  test('a missing fact and a blank answer are "not given": every operator is false except answered: false', () => {
    for (const fact of ['cones', 'note']) {
      for (const op of ['equals', 'in', 'gt', 'gte', 'lt', 'lte'] as const) {
        expect(ev(leaf(fact, op, op === 'in' ? [''] : op === 'equals' ? '' : 0)), `${op} on ${fact}`).toBe(false);
      }
      expect(ev(leaf(fact, 'answered', false))).toBe(true);
      expect(ev(leaf(fact, 'answered', true))).toBe(false);
    }
  });

  test('numeric operators are false on a text value (no coercion)', () => {
    expect(ev(leaf('glaze', 'gt', 0))).toBe(false);
    const f: Facts = new Map([['loads', '12']]);
    expect(evaluate(leaf('loads', 'gte', 1), f, { predicates: preds, rule: 'r' })).toBe(false);
  });
});

describe('combining operators', () => {
  test('all, any, not and ref', () => {
    const t = leaf('glaze', 'equals', 'ash');
    const f = leaf('glaze', 'equals', 'salt');
    expect(ev({ op: 'all', items: [t, t], pos })).toBe(true);
    expect(ev({ op: 'all', items: [t, f], pos })).toBe(false);
    expect(ev({ op: 'any', items: [f, t], pos })).toBe(true);
    expect(ev({ op: 'any', items: [f, f], pos })).toBe(false);
    expect(ev({ op: 'not', item: f, pos })).toBe(true);
    expect(ev({ op: 'ref', name: 'ash-glaze', pos })).toBe(true);
    expect(ev({ op: 'ref', name: 'no-such', pos })).toBe(false);
  });

  test('all and any stop early, so the trace shows only what was evaluated', () => {
    const trace: TraceStep[] = [];
    ev({ op: 'all', items: [leaf('glaze', 'equals', 'salt'), leaf('loads', 'gt', 3)], pos }, trace);
    expect(trace.map((s) => s.fact)).toEqual(['glaze']);
  });
});

describe('trace', () => {
  test('each leaf records fact, operator, expected, actual and result', () => {
    const trace: TraceStep[] = [];
    ev({ op: 'all', items: [leaf('glaze', 'in', ['ash', 'celadon']), leaf('loads', 'lt', 40)], pos }, trace);
    expect(trace).toEqual([
      { rule: 'r', fact: 'glaze', operator: 'in', expected: ['ash', 'celadon'], actual: 'ash', result: true },
      { rule: 'r', fact: 'loads', operator: 'lt', expected: 40, actual: 12, result: true },
    ]);
  });

  test('under not, a leaf is recorded as "not <operator>" with the result as it counts', () => {
    const trace: TraceStep[] = [];
    expect(ev({ op: 'not', item: leaf('loads', 'gte', 40), pos }, trace)).toBe(true);
    expect(trace).toEqual([{ rule: 'r', fact: 'loads', operator: 'not gte', expected: 40, actual: 12, result: true }]);
  });

  test('a missing fact is recorded with actual null', () => {
    const trace: TraceStep[] = [];
    ev(leaf('cones', 'equals', 'six'), trace);
    expect(trace[0]).toMatchObject({ fact: 'cones', actual: null, result: false });
  });

  test('the same check reached twice through a predicate is recorded once', () => {
    const trace: TraceStep[] = [];
    ev({ op: 'all', items: [{ op: 'ref', name: 'ash-glaze', pos }, { op: 'ref', name: 'ash-glaze', pos }], pos }, trace);
    expect(trace).toHaveLength(1);
  });
});
