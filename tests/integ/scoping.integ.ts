import { describe, expect, it } from 'vitest';
import { getRig, listRigs } from '@/db/queries/rigs';
import { listMembers, setMemberRoles } from '@/db/queries/members';
import { makeLab, makeRig } from './support/fixtures';

describe('lab scoping in the data layer', () => {
  it('never returns another lab’s rigs', async () => {
    const a = await makeLab();
    const b = await makeLab();
    const rigA = await makeRig(a.lab.id);
    const rigB = await makeRig(b.lab.id);

    const seenByA = await listRigs({ labId: a.lab.id });
    expect(seenByA.map((r) => r.id)).toEqual([rigA.id]);
    expect(await getRig({ labId: a.lab.id, rigId: rigB.id })).toBeNull();
    expect((await getRig({ labId: b.lab.id, rigId: rigB.id }))?.id).toBe(rigB.id);
  });

  it('lists only the lab’s own members, and changes roles only inside the lab', async () => {
    const a = await makeLab();
    const b = await makeLab();
    const membersA = await listMembers({ labId: a.lab.id });
    expect(membersA.map((m) => m.email).sort()).toEqual(Object.values(a.people).map((p) => p.email).sort());

    // A lab A admin's call with lab A's id cannot reach a lab B member.
    expect(await setMemberRoles({ labId: a.lab.id, userId: b.people.exp!.id, roles: ['lab_admin'] })).toBe(false);
    const bAfter = await listMembers({ labId: b.lab.id });
    expect(bAfter.find((m) => m.userId === b.people.exp!.id)?.roles).toEqual(['experimenter']);
  });
});
