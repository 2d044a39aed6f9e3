/**
 * The HTTP response for one schedule file, shared by the rig API and the app's export
 * route so that an approved version gives the same bytes and headers through both.
 */
import type { ScheduleMeta, Spec } from '@/lib/schedule';
import { byteStream, cacheKey, fromCache, renderIntoCache, scheduleChunks, storedSpec } from './render';
import {
  MEDIA_TYPES,
  contentDisposition,
  entityTag,
  ifNoneMatchHits,
  scheduleFileName,
  type ScheduleFormat,
} from './format';

export type ApprovedFile = {
  id: string;
  number: number;
  checksum: string;
  /** Stored with the checksum at submission (null for versions from before it was kept). */
  pulseCount?: number | null;
  decidedAt: Date | null;
  protocol: string;
  approverName: string | null;
  approverEmail: string | null;
};

/** Descriptive header of an approved file. The checksum and manifest are written by the engine. */
export function approvedMeta(v: ApprovedFile): ScheduleMeta {
  const by = v.approverEmail ? (v.approverName ? `${v.approverName} <${v.approverEmail}>` : v.approverEmail) : undefined;
  return {
    protocol: v.protocol,
    version: v.number,
    status: 'approved',
    approvedBy: by,
    approvedAt: v.decidedAt?.toISOString(),
  };
}

// The file may change only by being withdrawn (then 404): caches must ask every time,
// and only the requester may keep a copy — it was fetched with a credential.
const CACHE_CONTROL = 'private, no-cache';

export type FilePlan = { notModified: boolean; etag: string; fileName: string; respond: () => Promise<Response> };

/**
 * Decides 200 or 304 first, so the caller can audit what happened before responding.
 * `loadSpec` is called only when the cache does not hold the rendered file.
 */
export function planApprovedFile(
  request: Request,
  v: ApprovedFile,
  format: ScheduleFormat,
  vary: string,
  loadSpec: () => Promise<unknown>,
): FilePlan {
  const etag = entityTag(v.checksum);
  const fileName = scheduleFileName({ protocol: v.protocol, version: v.number, checksum: v.checksum, format });
  const common = { ETag: etag, 'Cache-Control': CACHE_CONTROL, Vary: vary };
  const notModified = ifNoneMatchHits(request.headers.get('if-none-match'), etag);
  return {
    notModified,
    etag,
    fileName,
    async respond() {
      if (notModified) return new Response(null, { status: 304, headers: common });
      const headers: Record<string, string> = {
        ...common,
        'Content-Type': MEDIA_TYPES[format],
        'Content-Disposition': contentDisposition(fileName),
        'X-Content-Type-Options': 'nosniff',
      };
      if (request.method === 'HEAD') return new Response(null, { status: 200, headers });
      const key = cacheKey(v.id, v.checksum, format);
      const known = v.pulseCount == null ? undefined : { checksum: v.checksum, pulseCount: v.pulseCount };
      const file =
        fromCache(key) ?? renderIntoCache(key, scheduleChunks(storedSpec(await loadSpec()), approvedMeta(v), format, known));
      if (file.length !== null) headers['Content-Length'] = String(file.length);
      return new Response(file.body as BodyInit, { status: 200, headers });
    },
  };
}

export type PreviewFile = { id: string; number: number; status: string; protocol: string; checksum: string };

/** Unapproved versions: PREVIEW_ file name, the preview notice in the file, never cached, no tag. */
export function previewFileResponse(spec: Spec, v: PreviewFile, format: ScheduleFormat): Response {
  const fileName = scheduleFileName({ protocol: v.protocol, version: v.number, checksum: v.checksum, format, preview: true });
  const meta: ScheduleMeta = { preview: true, protocol: v.protocol, version: v.number, status: v.status };
  const body = byteStream(scheduleChunks(spec, meta, format));
  return new Response(body as BodyInit, {
    status: 200,
    headers: {
      'Content-Type': MEDIA_TYPES[format],
      'Content-Disposition': contentDisposition(fileName),
      'Cache-Control': 'private, no-store',
      'X-Content-Type-Options': 'nosniff',
    },
  });
}
