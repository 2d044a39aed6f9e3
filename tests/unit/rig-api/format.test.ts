import { describe, expect, it } from 'vitest';
import { ifNoneMatchHits, negotiate, parseVersionRef, scheduleFileName, slug } from '@/lib/rig-api/format';

const ID = '3f0c2a4e-8d1b-4c6a-9e2f-5b7d8a9c0e1f';

describe('version path segment', () => {
  it('takes a uuid with an optional .csv or .json', () => {
    expect(parseVersionRef(ID)).toEqual({ id: ID, ext: null });
    expect(parseVersionRef(`${ID}.csv`)).toEqual({ id: ID, ext: 'csv' });
    expect(parseVersionRef(`${ID.toUpperCase()}.JSON`)).toEqual({ id: ID, ext: 'json' });
    for (const bad of [`${ID}.xml`, `${ID}.csv.json`, 'abc', '', `${ID}x`]) expect(parseVersionRef(bad), bad).toBeNull();
  });
});

describe('Accept negotiation (RFC 9110 §12.5.1: q-values, wildcards)', () => {
  it.each([
    [null, 'csv'],
    ['', 'csv'],
    ['*/*', 'csv'],
    ['text/csv', 'csv'],
    ['application/json', 'json'],
    ['text/csv;q=0.5, application/json', 'json'],
    ['application/json;q=0.2, text/csv;q=0.9', 'csv'],
    ['application/json, text/csv', 'json'], // equal q: the first listed
    ['*/*;q=0.8, application/json', 'json'], // the usual browser tail does not outrank an explicit type
    ['application/*', 'json'],
    ['text/html,application/xhtml+xml,application/xml;q=0.9,*/*;q=0.8', 'csv'],
    ['text/html', null],
    ['application/json;q=0, text/csv;q=0', null], // q=0 means "not acceptable"
  ])('%s → %s', (accept, want) => {
    expect(negotiate(accept)).toBe(want);
  });
});

describe('If-None-Match (RFC 9110 §13.1.2 uses the weak comparison)', () => {
  const tag = '"sha256:abc"';
  it('matches the tag, its weak form, a list holding it, and *', () => {
    expect(ifNoneMatchHits(tag, tag)).toBe(true);
    expect(ifNoneMatchHits('W/"sha256:abc"', tag)).toBe(true);
    expect(ifNoneMatchHits('"x", "sha256:abc"', tag)).toBe(true);
    expect(ifNoneMatchHits('*', tag)).toBe(true);
  });
  it('does not match other tags or an absent header', () => {
    expect(ifNoneMatchHits(null, tag)).toBe(false);
    expect(ifNoneMatchHits('"sha256:abd"', tag)).toBe(false);
    expect(ifNoneMatchHits('sha256:abc', tag)).toBe(false); // unquoted is not an entity tag
  });
});

describe('file names', () => {
  it('are ASCII slugs of the protocol with version and the first 12 hex digits of the checksum', () => {
    const checksum = `sha256:${'0123456789abcdef'.repeat(4)}`;
    expect(scheduleFileName({ protocol: 'CA1 théta / bursts', version: 3, checksum, format: 'csv' })).toBe('ca1-theta-bursts_v3_0123456789ab.csv');
    expect(scheduleFileName({ protocol: 'x', version: 1, checksum, format: 'json', preview: true })).toBe('PREVIEW_x_v1_0123456789ab.json');
    expect(slug('«»')).toBe('protocol');
    expect(slug('a'.repeat(100))).toHaveLength(60);
  });
});
