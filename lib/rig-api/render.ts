/**
 * Schedule files as HTTP bodies: the engine's CSV/JSON writers turned into a byte stream,
 * with the bytes of approved versions kept in the cache on the way through.
 */
import { csvBytes, jsonBytes, parseSpec, type KnownSchedule, type ScheduleMeta, type Spec } from '@/lib/schedule';
import { AppError } from '@/lib/http/errors';
import { scheduleCache, type ByteLru } from './cache';
import type { ScheduleFormat } from './format';

/** Pieces are gathered to about this size: fewer, larger writes to the socket. */
const CHUNK_BYTES = 64 * 1024;

/** A stored spec read back through the engine's schema; a bad one is a 422 with its paths. */
export function storedSpec(raw: unknown): Spec {
  const parsed = parseSpec(raw);
  if (!parsed.ok) {
    throw new AppError(422, 'invalid_spec', 'This version’s spec is not valid, so no schedule can be made from it.', parsed.errors.slice(0, 20));
  }
  return parsed.spec;
}

/**
 * The file's bytes as the engine writes them. `known` (the checksum and pulse count stored
 * with the version) saves the engine its counting pass; it then checks the pulses against
 * them and throws before the last chunk if they differ.
 */
export function scheduleChunks(spec: Spec, meta: ScheduleMeta, format: ScheduleFormat, known?: KnownSchedule): Generator<Uint8Array, void, undefined> {
  return format === 'csv' ? csvBytes(spec, meta, { known }) : jsonBytes(spec, meta, { known });
}

function concat(parts: Uint8Array[], total: number): Uint8Array {
  const out = new Uint8Array(total);
  let at = 0;
  for (const p of parts) {
    out.set(p, at);
    at += p.byteLength;
  }
  return out;
}

/**
 * A pull stream over byte chunks: the next piece is generated only when the socket
 * has taken the previous one, so memory holds one engine block and one 64 KB piece.
 * An error while generating (e.g. the pulses disagree with the stored checksum) ends
 * the response unfinished, so the rig never receives a complete-looking wrong file.
 * `keep` receives the whole file at the end if it stayed under `keepLimit` bytes.
 *
 * The first chunk is produced before the stream exists (the writers validate the spec
 * and scan the schedule for its checksum before yielding), so a failure there becomes
 * a proper error response instead of a cut-off download.
 */
export function byteStream(
  chunks: Generator<Uint8Array, void, undefined>,
  keep?: { limit: number; done: (bytes: Uint8Array) => void },
): ReadableStream<Uint8Array> {
  const first = chunks.next();
  let pending = first.done ? null : first.value;
  let parts: Uint8Array[] | null = keep ? [] : null;
  let total = 0;
  let finished = first.done === true;
  return new ReadableStream<Uint8Array>({
    pull(controller) {
      const gathered: Uint8Array[] = pending ? [pending] : [];
      let size = pending?.byteLength ?? 0;
      pending = null;
      try {
        while (!finished && size < CHUNK_BYTES) {
          const r = chunks.next();
          if (r.done) finished = true;
          else {
            gathered.push(r.value);
            size += r.value.byteLength;
          }
        }
      } catch (err) {
        console.error(`pulseloom: schedule stream stopped: ${err instanceof Error ? err.message : String(err)}`);
        parts = null;
        controller.error(err);
        return;
      }
      if (size > 0) {
        const bytes = gathered.length === 1 ? gathered[0]! : concat(gathered, size);
        if (parts) {
          total += bytes.byteLength;
          if (total > keep!.limit) parts = null;
          else parts.push(bytes);
        }
        controller.enqueue(bytes);
      }
      if (finished) {
        controller.close();
        if (parts && keep) keep.done(concat(parts, total));
        parts = null;
      }
    },
    cancel() {
      parts = null;
      chunks.return();
    },
  });
}

export type ScheduleBody = { body: Uint8Array | ReadableStream<Uint8Array>; length: number | null; fromCache: boolean };

/** The cached bytes of a file, or null. */
export function fromCache(key: string, cache: ByteLru = scheduleCache): ScheduleBody | null {
  const hit = cache.get(key);
  return hit ? { body: hit, length: hit.byteLength, fromCache: true } : null;
}

/** A stream of a freshly rendered file that fills the cache when it completes. */
export function renderIntoCache(key: string, chunks: Generator<Uint8Array, void, undefined>, cache: ByteLru = scheduleCache): ScheduleBody {
  const body = byteStream(chunks, { limit: cache.maxEntryBytes, done: (bytes) => cache.set(key, bytes) });
  return { body, length: null, fromCache: false };
}

/** Cached bytes when present; otherwise a stream that fills the cache when it completes. */
export function cachedScheduleBody(
  key: string,
  render: () => Generator<Uint8Array, void, undefined>,
  cache: ByteLru = scheduleCache,
): ScheduleBody {
  return fromCache(key, cache) ?? renderIntoCache(key, render(), cache);
}

export function cacheKey(versionId: string, checksum: string, format: ScheduleFormat): string {
  return `${versionId}:${checksum}:${format}`;
}
