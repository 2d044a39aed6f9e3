/**
 * The rig API called as the framework calls it: route handlers with a Request.
 * Token lifecycle, scoping (404 without a hint), only approved versions, ETag/304,
 * formats, audit rows and the failed-token rate limit.
 */
import { createHash, randomInt } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import { describe, expect, it, vi } from 'vitest';
import { GET as listVersions } from '@/app/api/rig/v1/versions/route';
import { GET as getVersion } from '@/app/api/rig/v1/versions/[id]/route';
import { db } from '@/db/client';
import { auditLog, rigTokens } from '@/db/schema';
import { createRigToken, revokeRigToken } from '@/lib/rigs/manage';
import { TOKEN_CACHE_TTL_MS } from '@/lib/rig-api/token-cache';
import { makeLab, makeRig } from './support/fixtures';
import { makeVersion, smallSpec } from './support/rig-fixtures';

const BASE = 'http://pulseloom.test';
// Each test speaks from its own address: the failed-token limiter is per address and per process.
const newIp = () => `10.${randomInt(1, 250)}.${randomInt(1, 250)}.${randomInt(1, 250)}`;

function request(path: string, token: string | null, ip: string, headers: Record<string, string> = {}) {
  return new Request(BASE + path, {
    headers: { 'x-forwarded-for': ip, ...(token ? { authorization: `Bearer ${token}` } : {}), ...headers },
  });
}

const list = (token: string | null, ip: string, headers?: Record<string, string>) =>
  listVersions(request('/api/rig/v1/versions', token, ip, headers));

const fetchFile = (segment: string, token: string | null, ip: string, headers?: Record<string, string>) =>
  getVersion(request(`/api/rig/v1/versions/${segment}`, token, ip, headers), { params: Promise.resolve({ id: segment }) });

async function setup() {
  const t = await makeLab();
  const rig = await makeRig(t.lab.id, { name: `Bench ${t.tag}` });
  const admin = { labId: t.lab.id, userId: t.people.admin!.id, email: t.people.admin!.email };
  const token = await createRigToken(admin, { rigId: rig.id, name: `pc-${t.tag}`, expiresInDays: 30 });
  return { ...t, rig, admin, token };
}

describe('rig tokens', () => {
  it('are 256-bit secrets stored only as their SHA-256, shown once at creation', async () => {
    const s = await setup();
    expect(s.token.secret).toMatch(/^plr_[A-Za-z0-9_-]{43}$/); // 32 random bytes → 43 base64url characters
    const [row] = await db.select().from(rigTokens).where(eq(rigTokens.id, s.token.id));
    // SHA-256 (FIPS 180-4) via node:crypto, independent of the app's helper.
    expect(row!.tokenHash).toBe(createHash('sha256').update(s.token.secret).digest('hex'));
    expect(JSON.stringify(row)).not.toContain(s.token.secret.slice(4));
    const [audit] = await db.select().from(auditLog).where(and(eq(auditLog.action, 'rig_token.created'), eq(auditLog.subjectId, s.token.id)));
    expect(audit!.actorUserId).toBe(s.admin.userId);
    expect(JSON.stringify(audit!.details)).not.toContain(s.token.secret.slice(4));
  });

  it('work until revoked, then get 401; use is recorded as last_used_at', async () => {
    const s = await setup();
    const ip = newIp();
    const ok = await list(s.token.secret, ip);
    expect(ok.status).toBe(200);
    const body = (await ok.json()) as { rig: { id: string; clockHz: number }; versions: unknown[] };
    expect(body.rig.id).toBe(s.rig.id);
    expect(body.rig.clockHz).toBe(s.rig.clockHz);
    const [used] = await db.select().from(rigTokens).where(eq(rigTokens.id, s.token.id));
    expect(used!.lastUsedAt).not.toBeNull();

    await revokeRigToken(s.admin, { rigId: s.rig.id, tokenId: s.token.id });
    const refused = await list(s.token.secret, ip);
    expect(refused.status).toBe(401);
    expect(refused.headers.get('www-authenticate')).toMatch(/^Bearer /);
    expect(((await refused.json()) as { error: { message: string } }).error.message).toMatch(/revoked/);
    const audits = await db.select().from(auditLog).where(and(eq(auditLog.action, 'rig_token.revoked'), eq(auditLog.subjectId, s.token.id)));
    expect(audits).toHaveLength(1);
  });

  it('expire: a token past its expiry gets 401', async () => {
    const s = await setup();
    const ip = newIp();
    expect((await list(s.token.secret, ip)).status).toBe(200);
    // Let the 30 days pass (only Date is faked: the database connection keeps real timers).
    vi.useFakeTimers({ toFake: ['Date'] });
    try {
      vi.setSystemTime(s.token.expiresAt.getTime() + 1000);
      const res = await list(s.token.secret, ip);
      expect(res.status).toBe(401);
      expect(((await res.json()) as { error: { message: string } }).error.message).toMatch(/expired/);
    } finally {
      vi.useRealTimers();
    }
  });

  it('changed outside the app (SQL) are seen within the token cache’s few seconds', async () => {
    const s = await setup();
    const ip = newIp();
    expect((await list(s.token.secret, ip)).status).toBe(200);
    await db.update(rigTokens).set({ revokedAt: new Date() }).where(eq(rigTokens.id, s.token.id));
    vi.useFakeTimers({ toFake: ['Date'] });
    try {
      vi.setSystemTime(Date.now() + TOKEN_CACHE_TTL_MS + 1);
      expect((await list(s.token.secret, ip)).status).toBe(401);
    } finally {
      vi.useRealTimers();
    }
  });

  it('are accepted only from the Authorization header', async () => {
    const s = await setup();
    const ip = newIp();
    expect((await list(null, ip)).status).toBe(401);
    const inUrl = await listVersions(new Request(`${BASE}/api/rig/v1/versions?token=${s.token.secret}`, { headers: { 'x-forwarded-for': ip } }));
    expect(inUrl.status).toBe(400);
    // Even alongside a valid header, a token in the URL is refused: it has leaked into logs.
    const both = await listVersions(
      new Request(`${BASE}/api/rig/v1/versions?access_token=${s.token.secret}`, { headers: { 'x-forwarded-for': ip, authorization: `Bearer ${s.token.secret}` } }),
    );
    expect(both.status).toBe(400);
    expect((await list(null, ip, { authorization: `Basic ${Buffer.from('a:b').toString('base64')}` })).status).toBe(401);
  });

  it('stop working while their rig is archived', async () => {
    const s = await setup();
    const { setRigArchived } = await import('@/lib/rigs/manage');
    const ip = newIp();
    await setRigArchived(s.admin, s.rig.id, true);
    expect((await list(s.token.secret, ip)).status).toBe(401);
    await setRigArchived(s.admin, s.rig.id, false);
    expect((await list(s.token.secret, ip)).status).toBe(200);
  });
});

describe('what a token can read', () => {
  it('lists only approved versions assigned to its rig in its lab', async () => {
    const s = await setup();
    const otherRig = await makeRig(s.lab.id);
    const approved = await makeVersion({ labId: s.lab.id, rigId: s.rig.id, spec: smallSpec(), status: 'approved', decidedBy: s.people.officer!.id });
    for (const status of ['draft', 'in_review', 'returned', 'withdrawn'] as const) {
      await makeVersion({ labId: s.lab.id, rigId: s.rig.id, spec: smallSpec(), status });
    }
    await makeVersion({ labId: s.lab.id, rigId: otherRig.id, spec: smallSpec(), status: 'approved' });

    const res = await list(s.token.secret, newIp());
    const body = (await res.json()) as { versions: { id: string; name: string; version: number; checksum: string; approvedAt: string; files: { csv: string } }[] };
    expect(body.versions.map((v) => v.id)).toEqual([approved.version.id]);
    const v = body.versions[0]!;
    expect(v.name).toBe(approved.protocolName);
    expect(v.version).toBe(1);
    expect(v.checksum).toBe(approved.checksum);
    expect(new Date(v.approvedAt).getTime()).toBe(approved.version.decidedAt!.getTime());
    expect(v.files.csv).toBe(`/api/rig/v1/versions/${approved.version.id}.csv`);
  });

  it('answers 404 with one message for unapproved, other-rig, other-lab and unknown ids', async () => {
    const s = await setup();
    const other = await makeLab();
    const otherLabRig = await makeRig(other.lab.id);
    const sameLabRig = await makeRig(s.lab.id);
    const ids: string[] = [];
    for (const status of ['draft', 'in_review', 'returned', 'withdrawn'] as const) {
      ids.push((await makeVersion({ labId: s.lab.id, rigId: s.rig.id, spec: smallSpec(), status })).version.id);
    }
    ids.push((await makeVersion({ labId: s.lab.id, rigId: sameLabRig.id, spec: smallSpec(), status: 'approved' })).version.id);
    ids.push((await makeVersion({ labId: other.lab.id, rigId: otherLabRig.id, spec: smallSpec(), status: 'approved' })).version.id);
    ids.push('00000000-0000-4000-8000-000000000000', 'not-a-uuid');

    const ip = newIp();
    const bodies = new Set<string>();
    for (const id of ids) {
      const res = await fetchFile(`${id}.csv`, s.token.secret, ip);
      expect(res.status, id).toBe(404);
      bodies.add(await res.text());
    }
    expect(bodies.size).toBe(1);
    // Nothing was downloaded, so nothing is audited as a download.
    expect(await db.select().from(auditLog).where(eq(auditLog.actorTokenId, s.token.id))).toEqual([]);
    // Those 404s were made with a valid token: they do not count as failed attempts.
    expect((await list(s.token.secret, ip)).status).toBe(200);
  });
});

describe('downloads', () => {
  async function approvedSetup() {
    const s = await setup();
    const v = await makeVersion({
      labId: s.lab.id,
      rigId: s.rig.id,
      spec: smallSpec(),
      status: 'approved',
      decidedBy: s.people.officer!.id,
      protocolName: `Théta bursts ${s.tag}`,
    });
    return { ...s, v };
  }

  it('carry the checksum as a strong ETag and answer If-None-Match with 304', async () => {
    const s = await approvedSetup();
    const ip = newIp();
    const res = await fetchFile(`${s.v.version.id}.csv`, s.token.secret, ip);
    expect(res.status).toBe(200);
    const etag = res.headers.get('etag')!;
    expect(etag).toBe(`"${s.v.checksum}"`);
    expect(etag.startsWith('W/')).toBe(false);
    await res.arrayBuffer();

    for (const inm of [etag, `W/${etag}`, `"sha256:nope", ${etag}`, '*']) {
      const again = await fetchFile(`${s.v.version.id}.csv`, s.token.secret, ip, { 'if-none-match': inm });
      expect(again.status, inm).toBe(304);
      expect(again.headers.get('etag')).toBe(etag);
      expect(await again.text()).toBe('');
    }
    const stale = await fetchFile(`${s.v.version.id}.csv`, s.token.secret, ip, { 'if-none-match': '"sha256:0000"' });
    expect(stale.status).toBe(200);
  });

  it('name the file by protocol, version and checksum prefix, and pick the format by extension or Accept', async () => {
    const s = await approvedSetup();
    const ip = newIp();
    const hex12 = s.v.checksum!.slice('sha256:'.length, 'sha256:'.length + 12);
    const csv = await fetchFile(`${s.v.version.id}.csv`, s.token.secret, ip);
    expect(csv.headers.get('content-type')).toBe('text/csv; charset=utf-8');
    expect(csv.headers.get('content-disposition')).toBe(`attachment; filename="theta-bursts-${s.tag}_v1_${hex12}.csv"`);
    const json = await fetchFile(`${s.v.version.id}.json`, s.token.secret, ip);
    expect(json.headers.get('content-type')).toBe('application/json; charset=utf-8');
    expect(json.headers.get('content-disposition')).toBe(`attachment; filename="theta-bursts-${s.tag}_v1_${hex12}.json"`);

    const byAccept = await fetchFile(s.v.version.id, s.token.secret, ip, { accept: 'text/csv;q=0.5, application/json' });
    expect(byAccept.headers.get('content-type')).toMatch(/^application\/json/);
    expect(byAccept.headers.get('vary')).toMatch(/Accept/);
    const plain = await fetchFile(s.v.version.id, s.token.secret, ip);
    expect(plain.headers.get('content-type')).toMatch(/^text\/csv/);
    expect((await fetchFile(s.v.version.id, s.token.secret, ip, { accept: 'text/html' })).status).toBe(406);
    // The extension wins over Accept.
    const ext = await fetchFile(`${s.v.version.id}.csv`, s.token.secret, ip, { accept: 'application/json' });
    expect(ext.headers.get('content-type')).toMatch(/^text\/csv/);
    await Promise.all([csv, json, byAccept, plain, ext].map((r) => r.arrayBuffer()));
  });

  it('write one audit row per download with the token’s name and the checksum', async () => {
    const s = await approvedSetup();
    const ip = newIp();
    const res = await fetchFile(`${s.v.version.id}.json`, s.token.secret, ip);
    await res.arrayBuffer();
    await (await fetchFile(`${s.v.version.id}.csv`, s.token.secret, ip, { 'if-none-match': `"${s.v.checksum}"` })).arrayBuffer();
    const head = await getVersion(
      new Request(`${BASE}/api/rig/v1/versions/${s.v.version.id}.csv`, { method: 'HEAD', headers: { 'x-forwarded-for': ip, authorization: `Bearer ${s.token.secret}` } }),
      { params: Promise.resolve({ id: `${s.v.version.id}.csv` }) },
    );
    expect(head.status).toBe(200);
    expect(head.headers.get('etag')).toBe(`"${s.v.checksum}"`);
    const rows = await db.select().from(auditLog).where(and(eq(auditLog.subjectId, s.v.version.id), eq(auditLog.actorTokenId, s.token.id)));
    expect(rows.map((r) => r.action).sort()).toEqual(['rig.version_downloaded', 'rig.version_unchanged']);
    const dl = rows.find((r) => r.action === 'rig.version_downloaded')!;
    expect(dl.actorLabel).toBe(`token ${s.token.name}`);
    expect(dl.labId).toBe(s.lab.id);
    expect(dl.checksum).toBe(s.v.checksum);
    expect(dl.ip).toBe(ip);
    expect(dl.details).toMatchObject({ format: 'json', rigId: s.rig.id });
  });
});

describe('failed tokens', () => {
  it('are limited per address: after 10 failures in a minute the address gets 429 with Retry-After', async () => {
    const s = await setup();
    const ip = newIp();
    for (let i = 0; i < 10; i++) {
      expect((await list(`plr_wrong${i}`, ip)).status).toBe(401);
    }
    const blocked = await list(s.token.secret, ip);
    expect(blocked.status).toBe(429);
    const retry = Number(blocked.headers.get('retry-after'));
    expect(retry).toBeGreaterThan(0);
    expect(retry).toBeLessThanOrEqual(60);
    // Another address with the valid token is unaffected.
    expect((await list(s.token.secret, newIp())).status).toBe(200);
  });
});
