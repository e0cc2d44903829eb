import { describe, expect, it } from 'vitest';
import { overlaps, parseLevel, parseReported, rangeOf, rangeOver } from '../../src/audit/digits.js';

function num(text: string) {
  const r = parseReported(text);
  if (!r.ok) throw new Error(r.message);
  return r.number;
}

describe('reported digits and their tolerance', () => {
  it('keeps trailing zeros: "0.0430" allows half a unit in the 4th decimal', () => {
    const n = num('0.0430');
    expect(n.value).toBe(0.043);
    expect(n.halfUnit).toBeCloseTo(0.00005, 15);
    expect(n.significant).toBe(3);
    expect(rangeOf(n)[0]).toBeCloseTo(0.04295, 15);
    expect(rangeOf(n)[1]).toBeCloseTo(0.04305, 15);
  });
  it('"0.043" is less precise than "0.0430"', () => {
    expect(num('0.043').halfUnit).toBeCloseTo(0.0005, 15);
  });
  it('whole numbers allow half a unit; scientific notation counts the mantissa digits', () => {
    expect(num('24').halfUnit).toBe(0.5);
    const s = num('1.20e-5');
    expect(s.value).toBeCloseTo(1.2e-5, 20);
    expect(s.halfUnit).toBeCloseTo(0.5e-7, 20);
    expect(s.significant).toBe(3);
    expect(num('3E+2').halfUnit).toBe(50);
  });
  it('reads a leading "p", signs, a leading decimal point', () => {
    expect(num('p = .021').value).toBe(0.021);
    expect(num('-2.14').value).toBe(-2.14);
    expect(num('+0.5').value).toBe(0.5);
  });
  it('reads bounds: "< 0.001", "p<=.05", "≥ 0.2"', () => {
    expect(num('< 0.001').bound).toBe('<');
    expect(rangeOf(num('< 0.001'))).toEqual([-Infinity, 0.001]);
    expect(num('p<=.05').bound).toBe('<=');
    expect(num('≥ 0.2').bound).toBe('>=');
    expect(rangeOf(num('> 0.2'))).toEqual([0.2, Infinity]);
  });
  it('refuses words and decimal commas with a message naming what is allowed', () => {
    const r = parseReported('0,043');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/decimal point/);
    const w = parseReported('n.s.');
    expect(w.ok).toBe(false);
    if (!w.ok) expect(w.message).toMatch(/allowed/);
  });
  it('parses confidence levels written several ways', () => {
    expect(parseLevel('95%')).toBeCloseTo(0.95, 12);
    expect(parseLevel(0.9)).toBe(0.9);
    expect(parseLevel('99')).toBeCloseTo(0.99, 12);
    expect(parseLevel('150%')).toBeUndefined();
    expect(parseLevel('high')).toBeUndefined();
  });
  it('overlaps and rangeOver', () => {
    expect(overlaps([1, 2], [2, 3])).toBe(true);
    expect(overlaps([1, 2], [2.001, 3])).toBe(false);
    expect(rangeOver([[1, 2], [3, 4]], (a, b) => a - b)).toEqual([-3, -1]);
  });
});
