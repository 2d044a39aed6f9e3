/**
 * How a schedule file is asked for and named: format from a path extension or the
 * Accept header, the download file name, and the entity tag.
 */
export type ScheduleFormat = 'csv' | 'json';

export const MEDIA_TYPES: Record<ScheduleFormat, string> = {
  csv: 'text/csv; charset=utf-8',
  json: 'application/json; charset=utf-8',
};

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** `<uuid>`, `<uuid>.csv` or `<uuid>.json` → id and explicit format; null when it is none of these. */
export function parseVersionRef(segment: string): { id: string; ext: ScheduleFormat | null } | null {
  const m = /^([^.]+)(?:\.(csv|json))?$/i.exec(decodeURIComponent(segment));
  if (!m || !UUID.test(m[1]!)) return null;
  return { id: m[1]!.toLowerCase(), ext: (m[2]?.toLowerCase() as ScheduleFormat | undefined) ?? null };
}

/**
 * The format an Accept header prefers (RFC 9110 §12.5.1 q-values; ties go to the
 * first listed). No header, or only wildcards → CSV, the rig PCs' usual format.
 * Null when the header rules out both formats (→ 406).
 */
export function negotiate(accept: string | null): ScheduleFormat | null {
  if (!accept || !accept.trim()) return 'csv';
  let best: { format: ScheduleFormat; q: number; order: number } | null = null;
  accept.split(',').forEach((part, order) => {
    const [type, ...params] = part.trim().toLowerCase().split(';').map((s) => s.trim());
    let q = 1;
    for (const p of params) {
      const [k, v] = p.split('=');
      if (k === 'q') q = Number(v);
    }
    if (!Number.isFinite(q) || q <= 0) return;
    const formats: ScheduleFormat[] =
      type === 'text/csv' ? ['csv'] : type === 'application/json' ? ['json'] : type === '*/*' || type === 'text/*' ? ['csv'] : type === 'application/*' ? ['json'] : [];
    for (const format of formats) {
      // An explicit type outranks a wildcard of the same q.
      const rank = q + (type.includes('*') ? 0 : 1e-6);
      if (!best || rank > best.q) best = { format, q: rank, order };
    }
  });
  return (best as { format: ScheduleFormat } | null)?.format ?? null;
}

/** Lower-case ASCII words joined by hyphens, for file names. */
export function slug(name: string): string {
  const s = name
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60)
    .replace(/-+$/, '');
  return s || 'protocol';
}

/** `<protocol>_v<n>_<first 12 hex of the checksum>.<ext>`, `PREVIEW_` in front for unapproved versions. */
export function scheduleFileName(a: { protocol: string; version: number; checksum: string; format: ScheduleFormat; preview?: boolean }): string {
  const hex = a.checksum.replace(/^sha256:/, '').slice(0, 12);
  return `${a.preview ? 'PREVIEW_' : ''}${slug(a.protocol)}_v${a.version}_${hex}.${a.format}`;
}

export function contentDisposition(fileName: string): string {
  return `attachment; filename="${fileName}"`;
}

/** The checksum names the approved schedule; as a strong tag it is quoted as is. */
export function entityTag(checksum: string): string {
  return `"${checksum}"`;
}

/** The entity tags of an If-None-Match header, W/ prefixes removed (weak comparison), and whether it is `*`. */
export function parseIfNoneMatch(header: string | null): { star: boolean; tags: string[] } {
  if (!header) return { star: false, tags: [] };
  if (header.trim() === '*') return { star: true, tags: [] };
  return { star: false, tags: header.split(',').map((t) => t.trim().replace(/^W\//, '')).filter(Boolean) };
}

/** If-None-Match uses the weak comparison (RFC 9110 §13.1.2): W/ prefixes are ignored; `*` matches. */
export function ifNoneMatchHits(header: string | null, etag: string): boolean {
  const { star, tags } = parseIfNoneMatch(header);
  const want = etag.replace(/^W\//, '');
  return star || tags.includes(want);
}
