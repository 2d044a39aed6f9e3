import { z } from 'zod';

// The audit page's filters arrive as search parameters; the page and the CSV route read
// them with this one schema, so the download always holds exactly the rows on screen
// (every page of them). Empty parameters mean "no filter".

const day = z.iso.date({ message: 'Use a date like 2031-04-30.' });
const blankToUndefined = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v);
const text = (max: number) => z.preprocess(blankToUndefined, z.string().trim().max(max).optional());

export const auditFilterSchema = z
  .object({
    action: text(100),
    /** Part of the actor's e-mail or token name, any case. */
    actor: text(200),
    subjectType: text(100),
    /** First day included (UTC). */
    from: z.preprocess(blankToUndefined, day.optional()),
    /** Last day included (UTC). */
    to: z.preprocess(blankToUndefined, day.optional()),
    page: z.preprocess(blankToUndefined, z.coerce.number().int().min(1).max(100_000).default(1)),
  })
  .refine((f) => !f.from || !f.to || f.from <= f.to, { message: 'The end date is before the start date.', path: ['to'] });

export type AuditFilter = z.infer<typeof auditFilterSchema>;

/** Search parameters (one value each; a repeated parameter keeps its first value) → plain object. */
export function searchParamsObject(params: URLSearchParams | Record<string, string | string[] | undefined>): Record<string, string> {
  const out: Record<string, string> = {};
  if (params instanceof URLSearchParams) {
    for (const [k, v] of params) if (!(k in out)) out[k] = v;
  } else {
    for (const [k, v] of Object.entries(params)) {
      const first = Array.isArray(v) ? v[0] : v;
      if (first !== undefined) out[k] = first;
    }
  }
  return out;
}

/** The filter as a query string (without the page), for links and the CSV download. */
export function filterQuery(f: Partial<AuditFilter>, page?: number): string {
  const q = new URLSearchParams();
  for (const key of ['action', 'actor', 'subjectType', 'from', 'to'] as const) {
    const v = f[key];
    if (v) q.set(key, v);
  }
  if (page && page > 1) q.set('page', String(page));
  const s = q.toString();
  return s ? `?${s}` : '';
}

/** [start, end) instants of the date range: `to` is a whole day, so the end is the next midnight (UTC). */
export function dateRange(f: Pick<AuditFilter, 'from' | 'to'>): { since?: Date; before?: Date } {
  return {
    since: f.from ? new Date(`${f.from}T00:00:00.000Z`) : undefined,
    before: f.to ? new Date(Date.parse(`${f.to}T00:00:00.000Z`) + 86_400_000) : undefined,
  };
}
