/**
 * Checksum of a schedule's pulse timing.
 *
 * Serialization (also written into every manifest as `checksumOf`): one ASCII line
 * `<trial>,<onsetSample>\n` per pulse, decimal integers without sign, padding or spaces,
 * trials ascending and onsets ascending within a trial, no header. The checksum is
 * `sha256:` + lowercase hex of SHA-256 over those bytes. In Python:
 *   hashlib.sha256(''.join(f'{t},{s}\n' for t, s in pulses).encode()).hexdigest()
 * Pulse parameters (width, amplitude, phases) are in the spec, hashed separately.
 *
 * Server-side (node:crypto): the engine's seed hashing stays pure for the browser.
 */
import { createHash, type Hash } from 'node:crypto';
import { ByteWriter, INT31_MAX, putInt31, putUint, wordsOf } from './bytes';

export const CHECKSUM_OF =
  "sha256 over UTF-8 lines '<trial>,<onsetSample>\\n' (decimal integers), trials ascending, onsets ascending within a trial, no header";

const CHUNK = 1 << 16;

export class ChecksumWriter {
  private hash: Hash = createHash('sha256');
  private w = new ByteWriter(CHUNK + 64);

  /** Append pulses of one trial (samples ascending). */
  add(trial: number, samples: ArrayLike<number>, length = samples.length): void {
    const w = this.w;
    const buf = w.buf;
    // "<trial>," once, then stored in front of every line as 32-bit words (the last
    // word may run past it; the sample digits overwrite that).
    const head = new Uint8Array(24);
    let hn = putUint(head, 0, trial);
    head[hn++] = 44; // ','
    const h32 = wordsOf(head.subarray(0, hn));
    const view = new DataView(buf.buffer, buf.byteOffset, buf.byteLength);
    let p = w.pos;
    for (let i = 0; i < length; i++) {
      if (p > CHUNK) {
        w.pos = p;
        this.flush();
        p = 0;
      }
      for (let k = 0; k < h32.length; k++) view.setUint32(p + 4 * k, h32[k], true);
      p += hn;
      const s = samples[i];
      p = s <= INT31_MAX ? putInt31(buf, p, s) : putUint(buf, p, s);
      buf[p++] = 10; // '\n'
    }
    w.pos = p;
  }

  /** Append lines already in the serialization above (the CSV writer makes them with its rows). */
  addLines(lines: Uint8Array): void {
    this.flush();
    this.hash.update(lines);
  }

  digest(): string {
    this.flush();
    return `sha256:${this.hash.digest('hex')}`;
  }

  private flush(): void {
    if (this.w.pos > 0) this.hash.update(this.w.buf.subarray(0, this.w.pos));
    this.w.pos = 0;
  }
}

export function sha256Text(text: string): string {
  return `sha256:${createHash('sha256').update(text, 'utf8').digest('hex')}`;
}
