import { describe, expect, it } from 'vitest';
import { db } from '@/db/client';
import { protocolVersions, protocols } from '@/db/schema';
import { listReviewQueue, queueFilterOptions } from '@/db/queries/versions';
import { queueQuerySchema } from '@/lib/versions/schemas';
import { makeLab, makeRig } from './support/fixtures';
import { CLEAN_SPEC } from './support/review-workflow';

type Status = 'draft' | 'in_review' | 'approved';

/** A lab with versions written straight into the table (the queue only reads them). */
async function labWithQueue() {
  const { lab, people } = await makeLab({ ada: ['experimenter'], ben: ['experimenter'], officer: ['safety_officer'] });
  const rigA = await makeRig(lab.id, { name: 'A rig' });
  const rigB = await makeRig(lab.id, { name: 'B rig' });
  const t0 = Date.UTC(2030, 0, 1);
  const plan: { name: string; status: Status; rig: string; author: string; minute: number }[] = [];
  for (let i = 0; i < 23; i++) {
    plan.push({ name: `P${String(i).padStart(2, '0')}`, status: 'in_review', rig: i % 3 === 0 ? rigB.id : rigA.id, author: i % 2 ? people.ben!.id : people.ada!.id, minute: 23 - i });
  }
  plan.push({ name: 'Q approved', status: 'approved', rig: rigA.id, author: people.ada!.id, minute: 100 });
  plan.push({ name: 'R draft', status: 'draft', rig: rigA.id, author: people.ada!.id, minute: 101 });
  for (const p of plan) {
    const [protocol] = await db.insert(protocols).values({ labId: lab.id, name: p.name, modality: 'optical' }).returning();
    const submitted = p.status === 'draft' ? null : new Date(t0 + p.minute * 60_000);
    await db.insert(protocolVersions).values({
      labId: lab.id,
      protocolId: protocol!.id,
      number: 1,
      status: p.status,
      spec: CLEAN_SPEC,
      rigId: p.rig,
      authorId: p.author,
      submittedAt: submitted,
      checksum: p.status === 'draft' ? null : 'sha256:x',
      approvedChecksum: p.status === 'approved' ? 'sha256:x' : null,
    });
  }
  return { lab, people, rigA, rigB };
}

const q = (raw: Record<string, string>) => queueQuerySchema.parse(raw);

describe('review queue query', () => {
  it('pages the versions in review, oldest submission first, 20 a page', async () => {
    const { lab } = await labWithQueue();
    await labWithQueue(); // another lab with the same 23 names: a leak would double the total
    const p1 = await listReviewQueue({ labId: lab.id, query: q({}) });
    expect(p1.total).toBe(23);
    expect(p1.rows).toHaveLength(20);
    expect(p1.rows[0]!.protocolName).toBe('P22'); // submitted at minute 1
    const times = p1.rows.map((r) => r.submittedAt!.getTime());
    expect([...times].sort((a, b) => a - b)).toEqual(times);
    const p2 = await listReviewQueue({ labId: lab.id, query: q({ page: '2' }) });
    expect(p2.rows.map((r) => r.protocolName)).toEqual(['P02', 'P01', 'P00']);
    const all = [...p1.rows, ...p2.rows].map((r) => r.id);
    expect(new Set(all).size).toBe(23);
    for (const r of [...p1.rows, ...p2.rows]) expect(r.protocolName.startsWith('P')).toBe(true);
  });

  it('filters by state, rig and author, and never lists drafts', async () => {
    const { lab, people, rigB } = await labWithQueue();
    const approved = await listReviewQueue({ labId: lab.id, query: q({ status: 'approved' }) });
    expect(approved.rows.map((r) => r.protocolName)).toEqual(['Q approved']);
    const any = await listReviewQueue({ labId: lab.id, query: q({ status: 'all', page: '2' }) });
    expect(any.total).toBe(24); // 23 in review + 1 approved; the draft is not the officers' business yet
    const onB = await listReviewQueue({ labId: lab.id, query: q({ rig: rigB.id }) });
    expect(onB.total).toBe(8); // i = 0, 3, …, 21
    expect(onB.rows.every((r) => r.rigName === 'B rig')).toBe(true);
    const byBen = await listReviewQueue({ labId: lab.id, query: q({ author: people.ben!.id }) });
    expect(byBen.total).toBe(11);
    const both = await listReviewQueue({ labId: lab.id, query: q({ author: people.ben!.id, rig: rigB.id }) });
    expect(both.rows.map((r) => r.protocolName).sort()).toEqual(['P03', 'P09', 'P15', 'P21']);
  });

  it('sorts by protocol name either way and counts past the last page', async () => {
    const { lab } = await labWithQueue();
    const desc = await listReviewQueue({ labId: lab.id, query: q({ sort: 'protocol', dir: 'desc' }) });
    expect(desc.rows.slice(0, 3).map((r) => r.protocolName)).toEqual(['P22', 'P21', 'P20']);
    const asc = await listReviewQueue({ labId: lab.id, query: q({ sort: 'protocol', dir: 'asc' }) });
    expect(asc.rows[0]!.protocolName).toBe('P00');
    const beyond = await listReviewQueue({ labId: lab.id, query: q({ page: '9' }) });
    expect(beyond).toEqual({ rows: [], total: 23 });
  });

  it('offers as filters only the rigs and authors of submitted versions', async () => {
    const { lab, people } = await labWithQueue();
    const opts = await queueFilterOptions({ labId: lab.id });
    expect(opts.rigs.map((r) => r.name)).toEqual(['A rig', 'B rig']);
    expect(opts.authors.map((a) => a.id).sort()).toEqual([people.ada!.id, people.ben!.id].sort());
  });
});
