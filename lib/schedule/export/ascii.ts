/** Text helpers for the exporters: bytes of fixed strings, and onset seconds written without String(). */
import { ByteWriter } from '../bytes';

export { ByteWriter };

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

/** Decimal digits of a non-negative safe integer into `out` (most significant first); returns the count. */
function digitsOf(x: number, out: Uint8Array): number {
  if (x < 1e9) return smallDigits(x | 0, out, 0);
  const hi = Math.floor(x / 1e9);
  const n = smallDigits(hi | 0, out, 0);
  let v = (x - hi * 1e9) | 0;
  for (let q = n + 8; q >= n; q--) {
    const y = (v / 10) | 0;
    out[q] = 48 + v - y * 10;
    v = y;
  }
  return n + 9;
}

/** v < 1e9 (int32 arithmetic), written at out[at…]; returns at + digit count. */
function smallDigits(v: number, out: Uint8Array, at: number): number {
  const len = v < 10 ? 1 : v < 100 ? 2 : v < 1e3 ? 3 : v < 1e4 ? 4 : v < 1e5 ? 5 : v < 1e6 ? 6 : v < 1e7 ? 7 : v < 1e8 ? 8 : 9;
  let q = at + len;
  do {
    const y = (v / 10) | 0;
    out[--q] = 48 + v - y * 10;
    v = y;
  } while (v > 0);
  return at + len;
}

/**
 * CSV rows `<trial>,<index>,<onset_s>,<onset_sample><suffix>` straight into bytes.
 * onset_s reuses the digits of sample·scale with the decimal point put in place, so a
 * row costs two digit conversions, not three; clocks without a finite decimal period
 * (e.g. 30 kHz) fall back to writeSeconds.
 */
export function writeRows(
  w: ByteWriter,
  prefix: Uint8Array,
  suffix: Uint8Array,
  samples: Float64Array,
  length: number,
  firstIndex: number,
  clockHz: number,
  plan: DecimalPlan | null,
): void {
  w.ensure(length * (prefix.length + suffix.length + 64));
  const b = w.buf;
  const tmp = new Uint8Array(24);
  const sd = new Uint8Array(24);
  let p = w.pos;
  const places = plan ? plan.places : 0;
  const scale = plan ? plan.scale : 1;
  const minV = plan ? plan.pow10 * 1e-6 : 0;
  for (let i = 0; i < length; i++) {
    const s = samples[i];
    for (let k = 0; k < prefix.length; k++) b[p++] = prefix[k];
    let n = digitsOf(firstIndex + i, tmp);
    for (let k = 0; k < n; k++) b[p++] = tmp[k];
    b[p++] = 44;
    const v = s * scale;
    let reuse = false;
    if (plan && v < 1e15 && (v === 0 || v >= minV)) {
      n = digitsOf(v, tmp);
      reuse = scale === 1;
      if (n <= places) {
        // 0.000ddd
        let end = n;
        while (end > 0 && tmp[end - 1] === 48) end--;
        if (end === 0) b[p++] = 48;
        else {
          b[p++] = 48;
          b[p++] = 46;
          for (let k = n; k < places; k++) b[p++] = 48;
          for (let k = 0; k < end; k++) b[p++] = tmp[k];
        }
      } else {
        const ip = n - places;
        for (let k = 0; k < ip; k++) b[p++] = tmp[k];
        let end = n;
        while (end > ip && tmp[end - 1] === 48) end--;
        if (end > ip) {
          b[p++] = 46;
          for (let k = ip; k < end; k++) b[p++] = tmp[k];
        }
      }
    } else {
      w.pos = p;
      writeSeconds(w, s, clockHz, null);
      p = w.pos;
    }
    b[p++] = 44;
    if (reuse) for (let k = 0; k < n; k++) b[p++] = tmp[k];
    else {
      n = digitsOf(s, sd);
      for (let k = 0; k < n; k++) b[p++] = sd[k];
    }
    for (let k = 0; k < suffix.length; k++) b[p++] = suffix[k];
  }
  w.pos = p;
}
