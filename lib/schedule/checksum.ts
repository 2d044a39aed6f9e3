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

export const CHECKSUM_OF =
  "sha256 over UTF-8 lines '<trial>,<onsetSample>\\n' (decimal integers), trials ascending, onsets ascending within a trial, no header";

const CHUNK = 1 << 16;

export class ChecksumWriter {
  private hash: Hash = createHash('sha256');
  private buf = new Uint8Array(CHUNK);
  private pos = 0;
  private digits = new Uint8Array(24);

  /** Append pulses of one trial (samples ascending). */
  add(trial: number, samples: ArrayLike<number>, length = samples.length): void {
    for (let i = 0; i < length; i++) {
      if (this.pos > CHUNK - 64) this.flush();
      this.writeInt(trial);
      this.buf[this.pos++] = 44; // ','
      this.writeInt(samples[i]);
      this.buf[this.pos++] = 10; // '\n'
    }
  }

  digest(): string {
    this.flush();
    return `sha256:${this.hash.digest('hex')}`;
  }

  private writeInt(x: number): void {
    let n = 0;
    do {
      const q = Math.floor(x / 10);
      this.digits[n++] = 48 + (x - q * 10);
      x = q;
    } while (x > 0);
    while (n > 0) this.buf[this.pos++] = this.digits[--n];
  }

  private flush(): void {
    if (this.pos > 0) this.hash.update(this.buf.subarray(0, this.pos));
    this.pos = 0;
  }
}

export function sha256Text(text: string): string {
  return `sha256:${createHash('sha256').update(text, 'utf8').digest('hex')}`;
}
