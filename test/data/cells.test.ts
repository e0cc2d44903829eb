/**
 * Reading one cell. The reference for numbers is JavaScript's own Number() on the accepted
 * grammar (ECMAScript StringToNumber, correctly rounded); the fast readings must give the very
 * same double, bit for bit (Object.is), on every input they accept.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { fastNumber, fastNumberBytes, hasNumericMarker, missingSet, readNumberCell } from '../../src/data/cells.js';

const missing = missingSet(undefined);

describe('readNumberCell', () => {
  it('reads plain decimals, signs, exponents and surrounding spaces', () => {
    for (const [text, value] of [
      ['12', 12],
      ['-0.5', -0.5],
      ['+3.25', 3.25],
      ['.25', 0.25],
      ['3.', 3],
      ['1.2e-3', 0.0012],
      ['  7.5 ', 7.5],
      ['-1E2', -100],
    ] as const) {
      expect(readNumberCell(text, missing)).toEqual({ kind: 'value', value });
    }
  });

  it('treats the empty cell and NA as missing by default, and other markers when given', () => {
    expect(readNumberCell('', missing).kind).toBe('missing');
    expect(readNumberCell('  ', missing).kind).toBe('missing');
    expect(readNumberCell('NA', missing).kind).toBe('missing');
    expect(readNumberCell('.', missing).kind).toBe('problem');
    const custom = missingSet(['.', '-99']);
    expect(readNumberCell('.', custom).kind).toBe('missing');
    expect(readNumberCell('-99', custom).kind).toBe('missing');
    expect(readNumberCell('NA', custom).kind).toBe('problem');
    expect(readNumberCell('', custom).kind).toBe('missing');
  });

  it('refuses what Number() would silently accept or turn into NaN/Infinity', () => {
    for (const text of ['0x1A', '1_000', 'Infinity', '-inf', 'NaN', 'nan', '12 kg', '1,5', '1.2.3', '--4', 'e5']) {
      expect(readNumberCell(text, missing).kind, text).toBe('problem');
    }
  });

  it('says what is wrong and what is allowed', () => {
    const nan = readNumberCell('NaN', missing);
    expect(nan).toMatchObject({ kind: 'problem', message: "'NaN' is not a measurement" });
    const comma = readNumberCell('12,5', missing);
    expect(comma.kind === 'problem' && comma.hint).toMatch(/decimal comma/);
    const word = readNumberCell('cracked', missing);
    expect(word.kind === 'problem' && word.hint).toMatch(/NA/);
  });

  it('refuses a value beyond the largest double instead of making it Infinity', () => {
    const r = readNumberCell('1e400', missing);
    expect(r.kind).toBe('problem');
    expect(r.kind === 'problem' && r.message).toMatch(/largest number/);
    expect(readNumberCell('1e300', missing)).toEqual({ kind: 'value', value: 1e300 });
  });

  it('knows when a marker looks like a number (the fast scan must then step aside)', () => {
    expect(hasNumericMarker(missingSet(['NA', '.']))).toBe(false);
    expect(hasNumericMarker(missingSet(['-99']))).toBe(true);
  });
});

describe('fast number readings', () => {
  const viaBytes = (s: string): number => {
    const out = [0.5];
    const b = Buffer.from(s, 'utf8');
    return fastNumberBytes(b, 0, b.length, out, 0) ? out[0] : NaN;
  };

  it('give the same double as Number() on plain decimals', () => {
    for (const s of ['0', '-0', '12.75', '-12.75', '0.1', '0.30000000000000004', '999999999999999', '1.000000000000001', '5.', '.5', '+8']) {
      const ref = Number(s);
      const fast = fastNumber(s, 0, s.length);
      if (!Number.isNaN(fast)) expect(Object.is(fast, ref), s).toBe(true);
      const b = viaBytes(s);
      if (!Number.isNaN(b)) expect(Object.is(b, ref), s).toBe(true);
    }
  });

  it('step aside (NaN) for exponents, spaces, long mantissas and non-numbers', () => {
    for (const s of ['1e3', ' 1', '1 ', '1234567890123456', 'NA', '', '-', '.', '1.2.3', '0x10']) {
      expect(fastNumber(s, 0, s.length), s).toBeNaN();
      expect(viaBytes(s), s).toBeNaN();
    }
  });

  it('agree with Number() on random decimals (property)', () => {
    const decimal = fc
      .tuple(fc.constantFrom('', '-', '+'), fc.stringMatching(/^[0-9]{0,12}$/), fc.boolean(), fc.stringMatching(/^[0-9]{0,10}$/))
      .map(([sign, int, point, frac]) => `${sign}${int}${point ? '.' : ''}${point ? frac : ''}`);
    fc.assert(
      fc.property(decimal, (s) => {
        const fast = fastNumber(s, 0, s.length);
        const bytes = viaBytes(s);
        const ref = readNumberCell(s, missing);
        if (!Number.isNaN(fast)) {
          expect(ref.kind).toBe('value');
          expect(Object.is(fast, Number(s))).toBe(true);
        }
        expect(Object.is(bytes, fast)).toBe(true);
      }),
      { numRuns: 2000 },
    );
  });
});
