/**
 * Schedule files as HTTP bodies: the engine's CSV/JSON writers turned into a byte stream,
 * with the bytes of approved versions kept in the cache on the way through.
 */
import { csvLines, jsonChunks, parseSpec, type ScheduleMeta, type Spec } from '@/lib/schedule';
import { AppError } from '@/lib/http/errors';
import { scheduleCache, type ByteLru } from './cache';
import type { ScheduleFormat } from './format';

/** Encoded pieces are gathered to about this size: fewer, larger writes to the socket. */
const CHUNK_CHARS = 64 * 1024;

/** A stored spec read back through the engine's schema; a bad one is a 422 with its paths. */
export function storedSpec(raw: unknown): Spec {
  const parsed = parseSpec(raw);
  if (!parsed.ok) {
    throw new AppError(422, 'invalid_spec', 'This version’s spec is not valid, so no schedule can be made from it.', parsed.errors.slice(0, 20));
  }
  return parsed.spec;
}

export function scheduleChunks(spec: Spec, meta: ScheduleMeta, format: ScheduleFormat): Generator<string, void, undefined> {
  return format === 'csv' ? csvLines(spec, meta) : jsonChunks(spec, meta);
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
 * A pull stream over string chunks: the next piece is generated only when the socket
 * has taken the previous one, so memory holds one engine block and one 64 KB piece.
 * `keep` receives the whole file at the end if it stayed under `keepLimit` bytes.
 *
 * The first chunk is produced before the stream exists (the writers validate the spec
 * and scan the schedule for its checksum before yielding), so a failure there becomes
 * a proper error response instead of a cut-off download.
 */
export function byteStream(
  chunks: Generator<string, void, undefined>,
  keep?: { limit: number; done: (bytes: Uint8Array) => void },
): ReadableStream<Uint8Array> {
  const encoder = new TextEncoder();
  const first = chunks.next();
  let pending = first.done ? null : first.value;
  let parts: Uint8Array[] | null = keep ? [] : null;
  let total = 0;
  return new ReadableStream<Uint8Array>({
    pull(controller) {
      let text = pending ?? '';
      pending = null;
      let finished = first.done === true;
      while (!finished && text.length < CHUNK_CHARS) {
        const r = chunks.next();
        if (r.done) finished = true;
        else text += r.value;
      }
      if (text.length > 0) {
        const bytes = encoder.encode(text);
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
export function renderIntoCache(key: string, chunks: Generator<string, void, undefined>, cache: ByteLru = scheduleCache): ScheduleBody {
  const body = byteStream(chunks, { limit: cache.maxEntryBytes, done: (bytes) => cache.set(key, bytes) });
  return { body, length: null, fromCache: false };
}

/** Cached bytes when present; otherwise a stream that fills the cache when it completes. */
export function cachedScheduleBody(
  key: string,
  render: () => Generator<string, void, undefined>,
  cache: ByteLru = scheduleCache,
): ScheduleBody {
  return fromCache(key, cache) ?? renderIntoCache(key, render(), cache);
}

export function cacheKey(versionId: string, checksum: string, format: ScheduleFormat): string {
  return `${versionId}:${checksum}:${format}`;
}
