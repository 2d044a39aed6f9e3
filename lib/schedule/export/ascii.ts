/** Text helpers for the exporters: bytes of fixed strings, and onset seconds written without String(). */
import { ByteWriter, putUint, wordsOf } from '../bytes';

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

/**
 * CSV rows `<trial>,<index>,<onset_s>,<onset_sample><suffix>` straight into bytes.
 * onset_s is written as integer part, '.', and the fraction's digits without trailing
 * zeros, from the integer sample·scale (no String, no float formatting); clocks
 * without a finite decimal period (e.g. 30 kHz) fall back to writeSeconds. The
 * constant prefix and suffix go in as 32-bit words; a word may run up to 3 bytes past
 * the constant, into room that the next field overwrites or that lies beyond `pos`.
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
  w.ensure(length * (prefix.length + suffix.length + 64) + 8);
  const b = w.buf;
  const view = new DataView(b.buffer, b.byteOffset, b.byteLength);
  const pre = wordsOf(prefix);
  const suf = wordsOf(suffix);
  const preLen = prefix.length;
  const sufLen = suffix.length;
  let p = w.pos;
  const places = plan ? plan.places : 0;
  const scale = plan ? plan.scale : 1;
  const pow10 = plan ? plan.pow10 : 1;
  const minV = plan ? plan.pow10 * 1e-6 : 0;
  for (let i = 0; i < length; i++) {
    const s = samples[i];
    for (let k = 0; k < pre.length; k++) view.setUint32(p + 4 * k, pre[k], true);
    p += preLen;
    p = putUint(b, p, firstIndex + i);
    b[p++] = 44;
    const v = s * scale;
    if (plan && v < FAST_LIMIT && (v === 0 || v >= minV)) {
      const ip = Math.floor(v / pow10);
      p = putUint(b, p, ip);
      const f = v - ip * pow10;
      if (f > 0) {
        let width = places;
        let q = f | 0;
        let y = (q / 10) | 0;
        while (q === y * 10) {
          q = y;
          y = (q / 10) | 0;
          width--;
        }
        b[p++] = 46; // '.'
        p += width;
        for (let k = 1; k <= width; k++) {
          y = (q / 10) | 0;
          b[p - k] = 48 + q - y * 10;
          q = y;
        }
      }
    } else {
      w.pos = p;
      writeSeconds(w, s, clockHz, null);
      p = w.pos;
    }
    b[p++] = 44;
    p = putUint(b, p, s);
    for (let k = 0; k < suf.length; k++) view.setUint32(p + 4 * k, suf[k], true);
    p += sufLen;
  }
  w.pos = p;
}
