/**
 * Byte-level text writing for the exporters: millions of rows per second need digits
 * written straight into a buffer instead of numbers turned into strings one by one.
 */

/** Growable byte buffer with decimal writers. */
export class ByteWriter {
  buf: Uint8Array;
  pos = 0;
  private digits = new Uint8Array(24);

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

  /** Non-negative safe integer, no padding. Caller ensures room (≤ 16 bytes). */
  uint(x: number): void {
    const d = this.digits;
    let n = 0;
    do {
      const q = Math.floor(x / 10);
      d[n++] = 48 + (x - q * 10);
      x = q;
    } while (x > 0);
    const b = this.buf;
    let p = this.pos;
    while (n > 0) b[p++] = d[--n];
    this.pos = p;
  }

  /** Exactly `width` digits, zero-padded, with trailing zeros dropped (a fraction). */
  fraction(x: number, width: number): void {
    const d = this.digits;
    for (let i = width - 1; i >= 0; i--) {
      const q = Math.floor(x / 10);
      d[i] = 48 + (x - q * 10);
      x = q;
    }
    let end = width;
    while (end > 0 && d[end - 1] === 48) end--;
    const b = this.buf;
    let p = this.pos;
    for (let i = 0; i < end; i++) b[p++] = d[i];
    this.pos = p;
  }

  /** Copy out what was written and start over. */
  take(): Uint8Array {
    const out = this.buf.slice(0, this.pos);
    this.pos = 0;
    return out;
  }
}

const encoder = new TextEncoder();
export const ascii = (s: string): Uint8Array => encoder.encode(s);

/**
 * How to write sample / clockHz as the shortest decimal that reads back to the same
 * double (what String(x) gives), without String: when clockHz = 2^a·5^b the quotient
 * is a finite decimal with m = max(a, b) places, and with at most 15 significant
 * digits that exact decimal is the shortest round-trip form. Returns null when the
 * clock needs the general path (e.g. 30 kHz, which has a factor 3).
 */
export interface DecimalPlan {
  /** 10^m / clockHz, an integer. */
  scale: number;
  places: number;
  pow10: number;
}

export function decimalPlan(clockHz: number): DecimalPlan | null {
  let a = 0;
  let b = 0;
  let r = clockHz;
  while (r % 2 === 0) {
    r /= 2;
    a++;
  }
  while (r % 5 === 0) {
    r /= 5;
    b++;
  }
  const places = Math.max(a, b);
  if (r !== 1 || places > 9) return null;
  const pow10 = 10 ** places;
  return { scale: pow10 / clockHz, places, pow10 };
}

/** Largest sample·scale kept on the fast path: 15 significant digits. */
const FAST_LIMIT = 1e15;

/** Write sample / clockHz as String(sample / clockHz) would. */
export function writeSeconds(w: ByteWriter, sample: number, clockHz: number, plan: DecimalPlan | null): void {
  if (plan) {
    const v = sample * plan.scale;
    // String() switches to exponent form below 1e-6; those values take the general path.
    if (v < FAST_LIMIT && (v === 0 || v >= plan.pow10 * 1e-6)) {
      const ip = Math.floor(v / plan.pow10);
      const frac = v - ip * plan.pow10;
      w.uint(ip);
      if (frac > 0) {
        w.buf[w.pos++] = 46; // '.'
        w.fraction(frac, plan.places);
      }
      return;
    }
  }
  const s = String(sample / clockHz);
  for (let i = 0; i < s.length; i++) w.buf[w.pos++] = s.charCodeAt(i);
}
