/** Text helpers for the exporters: bytes of fixed strings, and onset seconds written without String(). */
import { ByteWriter, INT31_MAX, putInt31, putUint, wordsOf } from '../bytes';

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

/** Scratch for one row's digits, read back as 32-bit words: index and comma, the sample, the scaled onset. */
const SCRATCH = new Uint8Array(96);
const SV = new DataView(SCRATCH.buffer);
const IB = 0; // pulse_index digits then ',', left-aligned
const SB = 32; // sample digits, left-aligned
const VB = 64; // sample·scale digits, left-aligned
const ZEROS = 0x30303030; // "0000"

/**
 * CSV rows `<trial>,<index>,<onset_s>,<onset_sample><suffix>` straight into bytes.
 *
 * Each number's digits are made once in a scratch buffer and copied out as 32-bit words
 * (a copy may run past the field; what follows overwrites it). onset_s is the digits of
 * sample·scale (an integer) with a '.' put `places` from the right and trailing zeros
 * dropped; when the clock is a power of ten those are the sample's own digits.
 * pulse_index is an ASCII counter, incremented in place. Clocks without a finite
 * decimal period (e.g. 30 kHz) and values past 2^31 take writeSeconds / putUint.
 * With `lines`, each row's checksum line (`<prefix><onset_sample>\n`, see checksum.ts)
 * is appended there from the same digits, so an export that checks its pulses does not
 * format every sample twice.
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
  lines: ByteWriter | null = null,
): void {
  w.ensure(length * (prefix.length + suffix.length + 64) + 16);
  lines?.ensure(length * (prefix.length + 24) + 16);
  const lb = lines ? lines.buf : w.buf;
  const lview = new DataView(lb.buffer, lb.byteOffset, lb.byteLength);
  let lp = lines ? lines.pos : 0;
  const b = w.buf;
  const view = new DataView(b.buffer, b.byteOffset, b.byteLength);
  const pre = wordsOf(prefix);
  const suf = wordsOf(suffix);
  const preLen = prefix.length;
  const sufLen = suffix.length;
  const sc = SCRATCH;
  const sv = SV;
  let il = putUint(sc, IB, firstIndex);
  sc[il] = 44;
  const places = plan ? plan.places : 0;
  const scale = plan ? plan.scale : 1;
  const same = scale === 1;
  const minV = plan ? plan.pow10 * 1e-6 : 0;
  let p = w.pos;
  for (let i = 0; i < length; i++) {
    const s = samples[i];
    for (let k = 0; k < pre.length; k++) view.setUint32(p + 4 * k, pre[k], true);
    p += preLen;
    // "<index>," from the counter: up to 16 digits and the comma.
    view.setUint32(p, sv.getUint32(IB, true), true);
    view.setUint32(p + 4, sv.getUint32(IB + 4, true), true);
    if (il > 7) {
      view.setUint32(p + 8, sv.getUint32(IB + 8, true), true);
      view.setUint32(p + 12, sv.getUint32(IB + 12, true), true);
      view.setUint32(p + 16, sv.getUint32(IB + 16, true), true);
    }
    p += il + 1;
    let q = il - 1;
    while (q >= 0 && sc[q] === 57) sc[q--] = 48;
    if (q >= 0) sc[q]++;
    else {
      sc.copyWithin(1, 0, il);
      sc[0] = 49;
      il++;
      sc[il] = 44;
    }

    const v = s * scale;
    // scale ≥ 1 (10^places / clockHz with clockHz = 2^a·5^b, places = max(a, b)), so s ≤ v.
    if (plan !== null && v <= INT31_MAX && (v >= minV || v === 0)) {
      // The sample's digits at sc[SB, SB + sl); the scaled onset's at sc[ob, ob + ol),
      // the same ones when scale is 1.
      const sl = putInt31(sc, SB, s) - SB;
      let ob = SB;
      let ol = sl;
      if (!same) {
        ob = VB;
        ol = putInt31(sc, VB, v) - VB;
      }
      // Integer part: the digits before the last `places`, or "0".
      const intLen = ol - places;
      let fs = ob;
      if (intLen > 0) {
        view.setUint32(p, sv.getUint32(ob, true), true);
        view.setUint32(p + 4, sv.getUint32(ob + 4, true), true);
        if (intLen > 8) view.setUint32(p + 8, sv.getUint32(ob + 8, true), true);
        p += intLen;
        fs = ob + intLen;
      } else b[p++] = 48;
      // Fraction: drop trailing zeros; "0" alone when nothing is left.
      let fe = ob + ol;
      while (fe > fs && sc[fe - 1] === 48) fe--;
      if (fe > fs) {
        b[p++] = 46; // '.'
        if (intLen < 0) {
          view.setUint32(p, ZEROS, true);
          view.setUint32(p + 4, ZEROS, true);
          view.setUint32(p + 8, ZEROS, true);
          p -= intLen;
        }
        view.setUint32(p, sv.getUint32(fs, true), true);
        view.setUint32(p + 4, sv.getUint32(fs + 4, true), true);
        view.setUint32(p + 8, sv.getUint32(fs + 8, true), true);
        p += fe - fs;
      }
      b[p++] = 44;
      view.setUint32(p, sv.getUint32(SB, true), true);
      view.setUint32(p + 4, sv.getUint32(SB + 4, true), true);
      view.setUint32(p + 8, sv.getUint32(SB + 8, true), true);
      p += sl;
      if (lines) {
        for (let k = 0; k < pre.length; k++) lview.setUint32(lp + 4 * k, pre[k], true);
        lp += preLen;
        lview.setUint32(lp, sv.getUint32(SB, true), true);
        lview.setUint32(lp + 4, sv.getUint32(SB + 4, true), true);
        lview.setUint32(lp + 8, sv.getUint32(SB + 8, true), true);
        lp += sl;
        lb[lp++] = 10; // '\n'
      }
    } else {
      w.pos = p;
      writeSeconds(w, s, clockHz, plan);
      p = w.pos;
      b[p++] = 44;
      p = putUint(b, p, s);
      if (lines) {
        for (let k = 0; k < pre.length; k++) lview.setUint32(lp + 4 * k, pre[k], true);
        lp = putUint(lb, lp + preLen, s);
        lb[lp++] = 10;
      }
    }
    for (let k = 0; k < suf.length; k++) view.setUint32(p + 4 * k, suf[k], true);
    p += sufLen;
  }
  w.pos = p;
  if (lines) lines.pos = lp;
}
