/**
 * Rendered schedule files, kept in process memory and bounded by total bytes.
 *
 * An approved version never changes (a database trigger forbids it), so its rendered
 * CSV or JSON is the same bytes forever: the first download renders while streaming,
 * later ones are answered from here. Keys are `<version id>:<checksum>:<format>` — the
 * checksum alone covers pulse timing but not the descriptive header (protocol name,
 * approver), so two versions with equal timing still get their own files.
 *
 * Files larger than the per-entry limit are not kept: they stream from the engine on
 * every request (memory stays flat, but they are regenerated each time).
 */
export const CACHE_TOTAL_BYTES = Number(process.env.PULSELOOM_RIG_CACHE_BYTES ?? 64 * 1024 * 1024);
export const CACHE_ENTRY_BYTES = Number(process.env.PULSELOOM_RIG_CACHE_ENTRY_BYTES ?? 16 * 1024 * 1024);

export class ByteLru {
  private map = new Map<string, Uint8Array>();
  private bytes = 0;
  hits = 0;
  misses = 0;

  constructor(
    readonly maxBytes: number,
    readonly maxEntryBytes: number,
  ) {}

  get(key: string): Uint8Array | undefined {
    const v = this.map.get(key);
    if (!v) {
      this.misses++;
      return undefined;
    }
    // Re-insert: Map iteration order is insertion order, so the oldest key is least recently used.
    this.map.delete(key);
    this.map.set(key, v);
    this.hits++;
    return v;
  }

  /** Returns false (and keeps nothing) when the value is over the per-entry limit. */
  set(key: string, value: Uint8Array): boolean {
    if (value.byteLength > this.maxEntryBytes || value.byteLength > this.maxBytes) return false;
    const old = this.map.get(key);
    if (old) {
      this.map.delete(key);
      this.bytes -= old.byteLength;
    }
    this.map.set(key, value);
    this.bytes += value.byteLength;
    for (const [k, v] of this.map) {
      if (this.bytes <= this.maxBytes) break;
      this.map.delete(k);
      this.bytes -= v.byteLength;
    }
    return true;
  }

  get size() {
    return this.map.size;
  }

  get totalBytes() {
    return this.bytes;
  }

  clear() {
    this.map.clear();
    this.bytes = 0;
  }
}

// One cache per server process, kept across hot reloads in development.
const g = globalThis as unknown as { pulseloomScheduleCache?: ByteLru };
export const scheduleCache: ByteLru = (g.pulseloomScheduleCache ??= new ByteLru(CACHE_TOTAL_BYTES, CACHE_ENTRY_BYTES));
