/**
 * Growable byte buffer with decimal writers: exports and checksums write millions of
 * numbers, and turning each into a string first costs several times more.
 */
export class ByteWriter {
  buf: Uint8Array;
  pos = 0;

  constructor(capacity = 1 << 16) {
    this.buf = new Uint8Array(capacity);
  }

  ensure(extra: number): void {
    if (this.pos + extra <= this.buf.length) return;
    const next = new Uint8Array(Math.max(this.buf.length * 2, this.pos + extra));
    next.set(this.buf.subarray(0, this.pos));
    this.buf = next;
  }

  bytes(b: Uint8Array): void {
    this.ensure(b.length);
    this.buf.set(b, this.pos);
    this.pos += b.length;
  }

  /** Non-negative safe integer in decimal, no padding. Caller ensures room (≤ 16 bytes). */
  uint(x: number): void {
    if (x < 1e9) {
      this.small(x);
      return;
    }
    const hi = Math.floor(x / 1e9);
    this.small(hi);
    this.padded(x - hi * 1e9, 9);
  }

  /** Exactly `width` digits, zero-padded, with trailing zeros dropped (a fraction's digits). */
  fraction(x: number, width: number): void {
    const start = this.pos;
    this.padded(x, width);
    while (this.pos > start && this.buf[this.pos - 1] === 48) this.pos--;
  }

  /** Copy out what was written and start over. */
  take(): Uint8Array {
    const out = this.buf.slice(0, this.pos);
    this.pos = 0;
    return out;
  }

  /** x < 1e9: digits counted first, then written right to left with int32 arithmetic. */
  private small(x: number): void {
    let v = x | 0;
    const len = v < 10 ? 1 : v < 100 ? 2 : v < 1e3 ? 3 : v < 1e4 ? 4 : v < 1e5 ? 5 : v < 1e6 ? 6 : v < 1e7 ? 7 : v < 1e8 ? 8 : 9;
    const b = this.buf;
    let q = this.pos + len;
    this.pos = q;
    do {
      const y = (v / 10) | 0;
      b[--q] = 48 + v - y * 10;
      v = y;
    } while (v > 0);
  }

  /** x < 10^width ≤ 1e9, zero-padded to width digits. */
  private padded(x: number, width: number): void {
    let v = x | 0;
    const b = this.buf;
    let q = this.pos + width;
    this.pos = q;
    for (let i = 0; i < width; i++) {
      const y = (v / 10) | 0;
      b[--q] = 48 + v - y * 10;
      v = y;
    }
  }
}

/** "00".."99" as ASCII pairs: two digits per division. */
const PAIRS = (() => {
  const t = new Uint8Array(200);
  for (let i = 0; i < 100; i++) {
    t[2 * i] = 48 + ((i / 10) | 0);
    t[2 * i + 1] = 48 + (i % 10);
  }
  return t;
})();

/** Largest value putInt31 takes. */
export const INT31_MAX = 2147483647;

/**
 * 0 ≤ x ≤ INT31_MAX in decimal at buf[pos…]; returns the position after it. Small and
 * not recursive, so V8 inlines it into the hot loops: digits counted first, then written
 * right to left two per division.
 */
export function putInt31(buf: Uint8Array, pos: number, x: number): number {
  let v = x | 0;
  const len = v < 10 ? 1 : v < 100 ? 2 : v < 1e3 ? 3 : v < 1e4 ? 4 : v < 1e5 ? 5 : v < 1e6 ? 6 : v < 1e7 ? 7 : v < 1e8 ? 8 : v < 1e9 ? 9 : 10;
  let q = pos + len;
  while (v >= 100) {
    const y = (v / 100) | 0;
    const r = (v - y * 100) << 1;
    buf[--q] = PAIRS[r + 1];
    buf[--q] = PAIRS[r];
    v = y;
  }
  if (v >= 10) {
    buf[--q] = PAIRS[(v << 1) + 1];
    buf[--q] = PAIRS[v << 1];
  } else buf[--q] = 48 + v;
  return pos + len;
}

/**
 * Non-negative safe integer in decimal at buf[pos…] (caller ensures ≤ 16 bytes of room);
 * returns the position after it.
 */
export function putUint(buf: Uint8Array, pos: number, x: number): number {
  if (x <= INT31_MAX) return putInt31(buf, pos, x);
  const hi = Math.floor(x / 1e9);
  pos = putUint(buf, pos, hi);
  return putPadded9(buf, pos, (x - hi * 1e9) | 0);
}

function putPadded9(buf: Uint8Array, pos: number, v: number): number {
  let q = pos + 9;
  for (let i = 0; i < 9; i++) {
    const y = (v / 10) | 0;
    buf[--q] = 48 + v - y * 10;
    v = y;
  }
  return pos + 9;
}

/** Bytes as little-endian 32-bit words (zero-padded), for writing a constant with a few wide stores. */
export function wordsOf(bytes: Uint8Array): Uint32Array {
  const words = new Uint32Array(Math.ceil(bytes.length / 4));
  for (let i = 0; i < bytes.length; i++) words[i >> 2] |= bytes[i] << (8 * (i & 3));
  return words;
}
