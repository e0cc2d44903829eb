/** The closed placeholder syntax: {name} and {name|default}; nothing else is interpreted. */
import { describe, expect, test } from 'vitest';
import { fill, placeholders } from '../../src/engine/templates.js';

const answers: Record<string, string | number> = { first_label: 'rye starter', second_label: 'baker\'s yeast', margin: 0.25, outcome_unit: '' };
const look = (n: string) => answers[n];

describe('templates', () => {
  test('fills answers, numbers and defaults', () => {
    expect(fill('each difference is {first_label} minus {second_label}', look)).toBe("each difference is rye starter minus baker's yeast");
    expect(fill('within ±{margin} {outcome_unit}.', look)).toBe('within ±0.25.');
    expect(fill('the event ({event|cracking})', look)).toBe('the event (cracking)');
  });

  test('lists placeholder names; expressions are not placeholders', () => {
    expect(placeholders('{a} and {b_c|x} but not {1+1} or {A}')).toEqual(['a', 'b_c']);
    // Names are looked up by the caller (answers in a Map), so these reach no object prototype;
    // a capitalised name is not a placeholder and stays as written.
    expect(fill('{constructor} {__proto__} {toString}', () => undefined)).toBe('{toString}');
  });
});
