import { describe, expect, it } from 'vitest';
import { createEnvelope, getEnvelope, listEnvelopes, restoreEnvelope, softDeleteEnvelope, updateEnvelopeSpec } from '@/db/queries/envelopes';
import { envelopeListQuerySchema } from '@/lib/envelopes/schema';
import { starterSpec } from '@/lib/envelopes/starters';
import { makeLab } from './support/fixtures';

const q = (over: Record<string, string> = {}) => envelopeListQuerySchema.parse(over);

describe('envelope drafts', () => {
  it('are scoped by lab, searchable, sortable, and soft-deleted with undo', async () => {
    const a = await makeLab();
    const b = await makeLab();
    const spec = starterSpec('optical', 's1');
    const alpha = await createEnvelope({ labId: a.lab.id, userId: a.people.exp!.id, name: 'Alpha ramp', description: 'slow rise', spec, modality: 'optical' });
    const beta = await createEnvelope({ labId: a.lab.id, userId: a.people.exp!.id, name: 'Beta 100%_sine', description: '', spec, modality: 'optical' });
    const other = await createEnvelope({ labId: b.lab.id, userId: b.people.exp!.id, name: 'Alpha elsewhere', description: '', spec, modality: 'optical' });

    expect((await listEnvelopes({ labId: a.lab.id, query: q() })).map((e) => e.id).sort()).toEqual([alpha, beta].sort());
    expect(await getEnvelope({ labId: a.lab.id, id: other })).toBeNull();
    expect(await updateEnvelopeSpec({ labId: a.lab.id, id: other, spec, modality: 'optical' })).toBe(false);

    expect((await listEnvelopes({ labId: a.lab.id, query: q({ q: 'RISE' }) })).map((e) => e.id)).toEqual([alpha]);
    // LIKE wildcards in the search text are literal characters, not patterns.
    expect((await listEnvelopes({ labId: a.lab.id, query: q({ q: '100%_' }) })).map((e) => e.id)).toEqual([beta]);
    expect((await listEnvelopes({ labId: a.lab.id, query: q({ q: '%' }) })).map((e) => e.id)).toEqual([beta]);

    const byNameDesc = await listEnvelopes({ labId: a.lab.id, query: q({ sort: 'name', dir: 'desc' }) });
    expect(byNameDesc.map((e) => e.name)).toEqual(['Beta 100%_sine', 'Alpha ramp']);

    expect(await softDeleteEnvelope({ labId: b.lab.id, id: alpha })).toBe(false); // another lab cannot delete it
    expect(await softDeleteEnvelope({ labId: a.lab.id, id: alpha })).toBe(true);
    expect((await listEnvelopes({ labId: a.lab.id, query: q() })).map((e) => e.id)).toEqual([beta]);
    expect(await getEnvelope({ labId: a.lab.id, id: alpha })).toBeNull();
    expect(await restoreEnvelope({ labId: a.lab.id, id: alpha })).toBe(true);
    expect((await getEnvelope({ labId: a.lab.id, id: alpha }))?.name).toBe('Alpha ramp');
  });

  it('ignores unknown sort words instead of failing', () => {
    expect(q({ sort: 'DROP TABLE', dir: 'sideways' })).toEqual({ sort: 'updated', dir: 'desc' });
  });
});
