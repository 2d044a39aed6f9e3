import { describe, expect, it } from 'vitest';
import { auditFilterSchema, dateRange, filterQuery, searchParamsObject } from '@/lib/audit/filters';

describe('audit filters', () => {
  it('reads empty parameters as no filter and defaults to the first page', () => {
    const f = auditFilterSchema.parse({ action: '', actor: '  ', from: '', page: '' });
    expect(f).toEqual({ page: 1, action: undefined, actor: undefined, subjectType: undefined, from: undefined, to: undefined });
  });

  it('refuses bad dates, a reversed range and a bad page with the field path', () => {
    const r = auditFilterSchema.safeParse({ from: '2031-02-30', to: 'yesterday', page: '0' });
    expect(r.success).toBe(false);
    const paths = r.error!.issues.map((i) => i.path.join('.'));
    expect(paths).toEqual(expect.arrayContaining(['from', 'to', 'page']));
    const reversed = auditFilterSchema.safeParse({ from: '2031-05-02', to: '2031-05-01' });
    expect(reversed.error!.issues[0]).toMatchObject({ path: ['to'], message: 'The end date is before the start date.' });
  });

  it('includes the whole last day: [from 00:00, day after to 00:00) in UTC', () => {
    const { since, before } = dateRange({ from: '2031-05-01', to: '2031-05-01' });
    expect(since?.toISOString()).toBe('2031-05-01T00:00:00.000Z');
    expect(before?.toISOString()).toBe('2031-05-02T00:00:00.000Z');
    expect(dateRange({})).toEqual({ since: undefined, before: undefined });
  });

  it('round-trips through the query string the page and the CSV link use', () => {
    const f = auditFilterSchema.parse({ action: 'limits.updated', actor: 'a&b@x.test', to: '2031-05-01', page: '3' });
    const q = filterQuery(f, f.page);
    expect(q).toBe('?action=limits.updated&actor=a%26b%40x.test&to=2031-05-01&page=3');
    expect(auditFilterSchema.parse(searchParamsObject(new URLSearchParams(q)))).toEqual(f);
    expect(filterQuery(f)).not.toContain('page');
  });

  it('takes the first value of a repeated parameter', () => {
    expect(searchParamsObject({ action: ['a', 'b'], actor: undefined })).toEqual({ action: 'a' });
    expect(searchParamsObject(new URLSearchParams('action=a&action=b'))).toEqual({ action: 'a' });
  });
});
