/**
 * Distinct values of a text column (ids, groups, conditions), interned without making a string
 * per row: the UTF-8 bytes of each new value go into one growing pool, and an open-addressing
 * table keyed by an FNV-1a hash of the bytes finds a value again by comparing bytes. A column of
 * 1,000,000 distinct ids then costs a few typed arrays instead of a million strings and a Map
 * (measured about 3 times faster here, and far lighter on memory).
 *
 * The plain scan interns bytes straight from the file; papaparse's strings are interned through
 * the same bytes (ASCII directly, anything else encoded as UTF-8), so both readers give every
 * value the same code. Example: intern "A7" then "A7" gives code 0 twice; "B2" then gets 1.
 */

const FNV_OFFSET = 0x811c9dc5;
const FNV_PRIME = 0x01000193;

/** ASCII white space trimmed from text cells (tab, line feed, vertical tab, form feed, CR, space). */
export function isAsciiSpace(c: number): boolean {
  return c === 32 || (c >= 9 && c <= 13);
}

export class LevelPool {
  private bytes: Uint8Array = new Uint8Array(1 << 12);
  private used = 0;
  /** Value i occupies bytes offsets[i] .. offsets[i + 1] - 1. */
  private offsets: Int32Array = new Int32Array(1 << 10);
  private table: Int32Array = new Int32Array(1 << 10).fill(-1);
  private cache: string[] = [];
  private encoder = new TextEncoder();
  count = 0;

  /** Bytes held so far (for estimating how many a column will need). */
  get size(): number {
    return this.used;
  }

  /** The code of the bytes `src[start, end)`, adding them as a new value when unseen. */
  internBytes(src: Uint8Array, start: number, end: number): number {
    let h = FNV_OFFSET;
    for (let k = start; k < end; k++) h = Math.imul(h ^ src[k], FNV_PRIME);
    const len = end - start;
    const size = this.table.length;
    let p = slotOf(h, size);
    for (;;) {
      const code = this.table[p];
      if (code < 0) break;
      const a = this.offsets[code];
      if (this.offsets[code + 1] - a === len && this.sameBytes(a, src, start, len)) return code;
      if (++p === size) p = 0;
    }
    return this.add(src, start, end, p);
  }

  /** The code of a string value (papaparse's cells, and lookups by name). */
  internString(s: string): number {
    const found = this.find(s);
    if (found >= 0) return found;
    const b = this.encoder.encode(s);
    return this.internBytes(b, 0, b.length);
  }

  /** The code of a string, or -1 when it does not occur. */
  find(s: string): number {
    const b = isAscii(s) ? null : this.encoder.encode(s);
    if (b) {
      const code = this.lookup(b, 0, b.length);
      return code;
    }
    let h = FNV_OFFSET;
    for (let k = 0; k < s.length; k++) h = Math.imul(h ^ s.charCodeAt(k), FNV_PRIME);
    const size = this.table.length;
    for (let p = slotOf(h, size); ; p = p + 1 === size ? 0 : p + 1) {
      const code = this.table[p];
      if (code < 0) return -1;
      const a = this.offsets[code];
      if (this.offsets[code + 1] - a === s.length && this.sameChars(a, s)) return code;
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
    if (size > this.table.length) this.rehash(size);
  }

  private lookup(src: Uint8Array, start: number, end: number): number {
    let h = FNV_OFFSET;
    for (let k = start; k < end; k++) h = Math.imul(h ^ src[k], FNV_PRIME);
    const len = end - start;
    const size = this.table.length;
    for (let p = slotOf(h, size); ; p = p + 1 === size ? 0 : p + 1) {
      const code = this.table[p];
      if (code < 0) return -1;
      const a = this.offsets[code];
      if (this.offsets[code + 1] - a === len && this.sameBytes(a, src, start, len)) return code;
    }
  }

  private add(src: Uint8Array, start: number, end: number, slot: number): number {
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
    const code = this.count++;
    this.offsets[this.count] = this.used;
    this.table[slot] = code;
    if (this.count * 4 > this.table.length * 3) this.rehash();
    return code;
  }

  private sameBytes(a: number, src: Uint8Array, start: number, len: number): boolean {
    for (let i = 0; i < len; i++) if (this.bytes[a + i] !== src[start + i]) return false;
    return true;
  }

  private sameChars(a: number, s: string): boolean {
    for (let i = 0; i < s.length; i++) if (this.bytes[a + i] !== s.charCodeAt(i)) return false;
    return true;
  }

  /** A larger table (load kept under 3/4, so probes stay short), every value placed again. */
  private rehash(size = this.table.length * 2): void {
    this.table = new Int32Array(size).fill(-1);
    for (let code = 0; code < this.count; code++) {
      let h = FNV_OFFSET;
      for (let k = this.offsets[code]; k < this.offsets[code + 1]; k++) h = Math.imul(h ^ this.bytes[k], FNV_PRIME);
      let p = slotOf(h, size);
      while (this.table[p] >= 0) if (++p === size) p = 0;
      this.table[p] = code;
    }
  }
}

/**
 * The table slot of a 32-bit hash: (h / 2^32) * size, a multiply instead of a remainder (which on
 * an unsigned 32-bit value would fall back to floating-point fmod); exact, as h * size < 2^53.
 */
function slotOf(h: number, size: number): number {
  return Math.floor((h >>> 0) * size * 2.3283064365386963e-10);
}

function isAscii(s: string): boolean {
  for (let i = 0; i < s.length; i++) if (s.charCodeAt(i) > 127) return false;
  return true;
}

function growU8(a: Uint8Array, need: number): Uint8Array {
  const b = new Uint8Array(Math.max(need, a.length * 2));
  b.set(a);
  return b;
}
