/**
 * The level pool must give exactly the codes a Map would (distinct values numbered in order of
 * first appearance), whether the values come sorted (no hash table), out of order (hash table),
 * or first sorted and then not (the switch). The reference here is a plain JavaScript Map.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { LevelPool } from '../../src/data/intern.js';

function codesByMap(values: string[]): number[] {
  const m = new Map<string, number>();
  return values.map((v) => {
    if (!m.has(v)) m.set(v, m.size);
    return m.get(v)!;
  });
}

function codesByPool(values: string[], viaBytes: boolean, reserve = 0): { codes: number[]; pool: LevelPool } {
  const pool = new LevelPool();
  if (reserve) pool.reserve(reserve, reserve * 4);
  const codes = values.map((v) => {
    if (!viaBytes) return pool.internString(v);
    const b = Buffer.from(v, 'utf8');
    return pool.internBytes(b, 0, b.length);
  });
  return { codes, pool };
}

describe('LevelPool', () => {
  it('numbers sorted ids without a hash table, and repeats of the last one', () => {
    const ids = ['rk01', 'rk02', 'rk02', 'rk03', 'rk10'];
    const { codes, pool } = codesByPool(ids, true);
    expect(codes).toEqual([0, 1, 1, 2, 3]);
    expect(pool.level(3)).toBe('rk10');
    expect(pool.find('rk02')).toBe(1);
    expect(pool.find('rk04')).toBe(-1);
  });

  it('switches to hashing at the first value out of order, keeping the codes', () => {
    const ids = ['T1', 'T2', 'T10', 'T3', 'T1', 'T10', 'T2', 'T11'];
    expect(codesByPool(ids, true).codes).toEqual(codesByMap(ids));
  });

  it('treats a proper prefix as smaller, and the empty value as a value', () => {
    const ids = ['ab', 'abc', 'ab', ''];
    expect(codesByPool(ids, true).codes).toEqual([0, 1, 0, 2]);
  });

  it('reads UTF-8 the same from bytes and from strings', () => {
    const ids = ['Åsen', 'Nørdal', 'Åsen', 'Ørje', 'Nørdal'];
    expect(codesByPool(ids, true).codes).toEqual(codesByMap(ids));
    expect(codesByPool(ids, false).codes).toEqual(codesByMap(ids));
    expect(codesByPool(ids, true).pool.level(1)).toBe('Nørdal');
  });

  it('agrees with a Map on random sequences, with and without a reservation (property)', () => {
    const value = fc.oneof(fc.stringMatching(/^[a-c]{0,3}$/), fc.string({ maxLength: 4 }), fc.integer({ min: 0, max: 40 }).map((i) => `id${i}`));
    fc.assert(
      fc.property(fc.array(value, { maxLength: 200 }), fc.boolean(), fc.constantFrom(0, 5, 5000), (values, bytes, reserve) => {
        const { codes, pool } = codesByPool(values, bytes, reserve);
        expect(codes).toEqual(codesByMap(values));
        for (const v of values) expect(pool.level(pool.find(v))).toBe(v);
      }),
      { numRuns: 300 },
    );
  });

  it('handles many distinct values in both modes (sorted, then shuffled)', () => {
    const sorted = Array.from({ length: 20000 }, (_, i) => `u${String(i).padStart(6, '0')}`);
    expect(codesByPool(sorted, true, 20000).codes).toEqual(sorted.map((_, i) => i));
    const shuffled = sorted.map((s, i) => sorted[(i * 7919) % sorted.length]);
    expect(codesByPool([...shuffled, ...shuffled.slice(0, 100)], true).codes).toEqual(codesByMap([...shuffled, ...shuffled.slice(0, 100)]));
  });
});
