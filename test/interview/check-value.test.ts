/** One answer against its question: the rules shared by typed answers and answers files. */
import { describe, expect, it } from 'vitest';
import type { Question } from '../../src/engine/types.js';
import { checkValue, describeAllowed, parseTyped } from '../../src/interview/check-value.js';

// An invented ceramics question: how much thicker a glaze layer may differ and still count as equal.
const margin: Question = { id: 'glaze_margin', type: 'number', min: 0, minExclusive: true, text: 'Margin?', help: 'In mm.' };
const kilns: Question = { id: 'kilns', type: 'number', integer: true, min: 1, max: 12, optional: true, text: 'Kilns?', help: 'Count.' };

describe('checkValue and parseTyped', () => {
  it('says what is allowed in words', () => {
    expect(describeAllowed(margin)).toBe('a number greater than 0');
    expect(describeAllowed(kilns)).toBe('a whole number from 1 to 12, or blank');
  });

  it('keeps a minimum exclusive when the question says so', () => {
    expect(checkValue(margin, 0)).toMatchObject({ ok: false, code: 'unknown-value' });
    expect(checkValue(margin, 0.05)).toEqual({ ok: true, value: 0.05 });
    expect(parseTyped(margin, '0')).toEqual({ ok: false, message: '0 is too small. Allowed: a number greater than 0.' });
  });

  it('records an optional question left blank as the empty string', () => {
    expect(parseTyped(kilns, '   ')).toEqual({ ok: true, value: '' });
    expect(checkValue(kilns, null)).toEqual({ ok: true, value: '' });
    expect(checkValue(margin, null)).toMatchObject({ ok: false, code: 'wrong-type' });
  });

  it('reads only plain decimal numbers when typed', () => {
    expect(parseTyped(kilns, ' 7 ')).toEqual({ ok: true, value: 7 });
    expect(parseTyped(margin, '.25')).toEqual({ ok: true, value: 0.25 });
    expect(parseTyped(margin, '2e-1')).toEqual({ ok: true, value: 0.2 });
    for (const s of ['Infinity', '0x1', '1,5', '1.2.3', '--1', 'NaN']) expect(parseTyped(margin, s).ok).toBe(false);
  });
});
