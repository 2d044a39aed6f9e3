import { describe, expect, it } from 'vitest';
import { decisionSchema, protocolFormSchema, queueQuerySchema, submitSchema } from '@/lib/versions/schemas';

const uuid = '3f1c2b9e-8a4d-4c3b-9f2e-1a2b3c4d5e6f';

describe('decisionSchema', () => {
  it('requires a comment to return a version, with the field path', () => {
    const r = decisionSchema.safeParse({ versionId: uuid, revision: 2, decision: 'return', comment: '   ' });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0]).toMatchObject({ path: ['comment'] });
  });

  it('approves without a comment and reads the revision from a form string', () => {
    const r = decisionSchema.parse({ versionId: uuid, revision: '3', decision: 'approve' });
    expect(r).toEqual({ versionId: uuid, revision: 3, decision: 'approve', comment: '' });
  });
});

describe('submitSchema', () => {
  it('refuses a negative or fractional revision', () => {
    expect(submitSchema.safeParse({ versionId: uuid, revision: -1 }).success).toBe(false);
    expect(submitSchema.safeParse({ versionId: uuid, revision: 1.5 }).success).toBe(false);
  });
});

describe('protocolFormSchema', () => {
  it('names each missing field', () => {
    const r = protocolFormSchema.safeParse({ name: ' ', purpose: '', modality: 'sound', target: '', rigIds: [], startFrom: 'x' });
    expect(r.success).toBe(false);
    expect(r.error!.issues.map((i) => i.path.join('.')).sort()).toEqual(['modality', 'name', 'rigIds', 'startFrom']);
  });
});

describe('queueQuerySchema', () => {
  it('defaults to the versions waiting, oldest first, page 1', () => {
    expect(queueQuerySchema.parse({})).toEqual({ status: 'in_review', sort: 'submitted', dir: 'asc', page: 1 });
  });

  it('falls back field by field on garbage instead of failing the page', () => {
    const q = queueQuerySchema.parse({ status: 'nope', rig: 'x', sort: 'drop table', dir: 'up', page: '-3' });
    expect(q).toEqual({ status: 'in_review', rig: undefined, sort: 'submitted', dir: 'asc', page: 1 });
  });
});
