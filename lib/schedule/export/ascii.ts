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
