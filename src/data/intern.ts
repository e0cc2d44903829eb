/**
 * Distinct values of a text column (ids, groups, conditions), interned without making a string
 * per row: the UTF-8 bytes of each new value go into one growing pool, and each row gets the code
 * of its value (codes count the distinct values in order of first appearance).
 *
 * Two ways to find a value again:
 * - While the values arrive in increasing byte order (ids exported sorted: A01, A02, ...), a new
 *   value only needs comparing with the previous one: greater means new, equal means the same.
 *   No hash table is built, and a sorted million-id column costs one pass over its bytes.
 * - At the first value out of order, an open-addressing hash table (FNV-1a over the bytes,
 *   linear probing, load under 3/4) is built over the values so far and used from then on.
 * Both give the same codes. A column of 1,000,000 distinct ids costs a few typed arrays instead of
 * a million strings and a Map (measured several times faster here, and far lighter on memory).
 *
 * The plain scan interns bytes straight from the file; papaparse's strings are interned through
 * the same bytes (ASCII directly, anything else encoded as UTF-8), so both readers give every
 * value the same code. Example: "A7", "B2", "A7" get the codes 0, 1, 0.
 */
import { InputError } from '../errors.js';

const FNV_OFFSET = 0x811c9dc5;
const FNV_PRIME = 0x01000193;
/**
 * Table entries hold code * 64 + the hash's low 6 bits: a probe skips most non-matching entries
 * without reading the value's bytes, at the cost of capping a column at 2^31 / 64 (about 33
 * million) distinct values.
 */
const TAG_BITS = 6;
const TAG = (1 << TAG_BITS) - 1;
export const MAX_LEVELS = 2 ** (31 - TAG_BITS);

/** ASCII white space trimmed from text cells (tab, line feed, vertical tab, form feed, CR, space). */
export function isAsciiSpace(c: number): boolean {
  return c === 32 || (c >= 9 && c <= 13);
}

export class LevelPool {
  private bytes: Uint8Array = new Uint8Array(1 << 12);
  private used = 0;
  /** Value i occupies bytes offsets[i] .. offsets[i + 1] - 1. */
  private offsets: Int32Array = new Int32Array(1 << 10);
  /** Null while the values have come in increasing order (see above). */
  private table: Int32Array | null = null;
  /** The table size to build when one is needed (raised by `reserve`). */
  private tableSize = 1 << 10;
  private cache: string[] = [];
  private encoder = new TextEncoder();
  count = 0;

  /** Bytes held so far (for estimating how many a column will need). */
  get size(): number {
    return this.used;
  }

  /** The code of the bytes `src[start, end)`, adding them as a new value when unseen. */
  internBytes(src: Uint8Array, start: number, end: number): number {
    if (this.table === null) {
      const order = this.count === 0 ? 1 : this.compareLast(src, start, end);
      if (order > 0) return this.add(src, start, end);
      if (order === 0) return this.count - 1;
      this.buildTable();
    }
    return this.hashed(src, start, end);
  }

  /** The code of a string value (papaparse's cells, and lookups by name). */
  internString(s: string): number {
    const b = this.encoder.encode(s);
    return this.internBytes(b, 0, b.length);
  }

  /** The code of a string, or -1 when it does not occur. */
  find(s: string): number {
    const b = this.encoder.encode(s);
    if (this.table === null) this.buildTable();
    const table = this.table!;
    const h = hashOf(b, 0, b.length);
    for (let p = slotOf(h, table.length); ; p = p + 1 === table.length ? 0 : p + 1) {
      const e = table[p];
      if (e < 0) return -1;
      const code = e >>> TAG_BITS;
      if ((e & TAG) === (h & TAG) && this.equals(code, b, 0, b.length)) return code;
    }
  }

  /** The text of value `code`. */
  level(code: number): string {
    const hit = this.cache[code];
    if (hit !== undefined) return hit;
    const s = Buffer.from(this.bytes.buffer, this.bytes.byteOffset + this.offsets[code], this.offsets[code + 1] - this.offsets[code]).toString('utf8');
    if (code < 10000) this.cache[code] = s;
    return s;
  }

  /**
   * Makes room for about `levels` values and `bytes` bytes at once, so a column of a million
   * distinct ids does not pass through a series of doublings (each leaving the old copy behind).
   */
  reserve(levels: number, bytes: number): void {
    if (bytes > this.bytes.length) this.bytes = growU8(this.bytes, bytes);
    if (levels + 2 > this.offsets.length) {
      const o = new Int32Array(levels + 2);
      o.set(this.offsets.subarray(0, this.count + 1));
      this.offsets = o;
    }
    const size = Math.ceil(levels / 0.7) + 1;
    if (size > this.tableSize) {
      this.tableSize = size;
      if (this.table) this.rehash(size);
    }
  }

  private hashed(src: Uint8Array, start: number, end: number): number {
    const table = this.table!;
    const h = hashOf(src, start, end);
    const tag = h & TAG;
    const size = table.length;
    let p = slotOf(h, size);
    for (;;) {
      const e = table[p];
      if (e < 0) break;
      if ((e & TAG) === tag && this.equals(e >>> TAG_BITS, src, start, end - start)) return e >>> TAG_BITS;
      if (++p === size) p = 0;
    }
    const code = this.add(src, start, end);
    table[p] = code * (TAG + 1) + tag;
    if (this.count * 4 > size * 3) this.rehash(size * 2);
    return code;
  }

  /** Byte order of `src[start, end)` against the last value added (a proper prefix sorts first). */
  private compareLast(src: Uint8Array, start: number, end: number): number {
    const bytes = this.bytes;
    const a = this.offsets[this.count - 1];
    const alen = this.offsets[this.count] - a;
    const len = end - start;
    const n = Math.min(alen, len);
    for (let i = 0; i < n; i++) {
      const d = src[start + i] - bytes[a + i];
      if (d !== 0) return d;
    }
    return len - alen;
  }

  private add(src: Uint8Array, start: number, end: number): number {
    if (this.count >= MAX_LEVELS) throw new InputError(`a text column holds more than ${MAX_LEVELS} distinct values (ids); tandem reads at most that many`);
    const len = end - start;
    if (this.used + len > this.bytes.length) this.bytes = growU8(this.bytes, this.used + len);
    // A plain loop: subarray() would make a Buffer object per new value (a million of them here).
    const bytes = this.bytes;
    for (let i = 0, at = this.used; i < len; i++) bytes[at + i] = src[start + i];
    this.used += len;
    if (this.count + 2 > this.offsets.length) {
      const o = new Int32Array(this.offsets.length * 2);
      o.set(this.offsets);
      this.offsets = o;
    }
    this.count++;
    this.offsets[this.count] = this.used;
    return this.count - 1;
  }

  private equals(code: number, src: Uint8Array, start: number, len: number): boolean {
    const a = this.offsets[code];
    if (this.offsets[code + 1] - a !== len) return false;
    const bytes = this.bytes;
    for (let i = 0; i < len; i++) if (bytes[a + i] !== src[start + i]) return false;
    return true;
  }

  private buildTable(): void {
    this.rehash(Math.max(this.tableSize, Math.ceil(this.count / 0.7) + 1));
  }

  /** A table of `size` slots with every value placed again. */
  private rehash(size: number): void {
    const table = new Int32Array(size).fill(-1);
    for (let code = 0; code < this.count; code++) {
      const h = hashOf(this.bytes, this.offsets[code], this.offsets[code + 1]);
      let p = slotOf(h, size);
      while (table[p] >= 0) if (++p === size) p = 0;
      table[p] = code * (TAG + 1) + (h & TAG);
    }
    this.table = table;
    this.tableSize = size;
  }
}

function hashOf(src: Uint8Array, start: number, end: number): number {
  let h = FNV_OFFSET;
  for (let k = start; k < end; k++) h = Math.imul(h ^ src[k], FNV_PRIME);
  return h;
}

/**
 * The table slot of a 32-bit hash: (h / 2^32) * size, a multiply instead of a remainder (which on
 * an unsigned 32-bit value would fall back to floating-point fmod); exact, as h * size < 2^53.
 */
function slotOf(h: number, size: number): number {
  return Math.floor((h >>> 0) * size * 2.3283064365386963e-10);
}

function growU8(a: Uint8Array, need: number): Uint8Array {
  const b = new Uint8Array(Math.max(need, a.length * 2));
  b.set(a);
  return b;
}
