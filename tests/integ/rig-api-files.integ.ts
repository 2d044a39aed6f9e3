/**
 * What is in the downloaded files: CSV and JSON from the rig API against the engine
 * (in-memory generator, verifier, CLI) and against the Python example script's own
 * checksum code; the app's exports (cautions first, previews marked, approved files
 * identical to the rig's); the cache of approved files.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { and, eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { GET as getVersion } from '@/app/api/rig/v1/versions/[id]/route';
import { db } from '@/db/client';
import { auditLog } from '@/db/schema';
import { acknowledgeCautions } from '@/lib/exports/acknowledge';
import { exportVersionFile } from '@/lib/exports/export';
import { AppError } from '@/lib/http/errors';
import { scheduleCache } from '@/lib/rig-api/cache';
import { createRigToken } from '@/lib/rigs/manage';
import { CSV_HEADER, PREVIEW_NOTICE, generateSchedule, verifySchedule, type Spec } from '@/lib/schedule';
import { makeLab, makeRig } from './support/fixtures';
import { exampleSpec, makeVersion, smallSpec } from './support/rig-fixtures';

const root = new URL('../../', import.meta.url).pathname;
const hasPython = spawnSync('python3', ['--version']).status === 0;
let ipSeq = 0;

async function setup(spec: Spec, modality: 'optical' | 'electrical' = 'optical') {
  const t = await makeLab();
  const rig = await makeRig(t.lab.id, modality === 'optical' ? { clockHz: spec.clockHz } : { modality, clockHz: spec.clockHz, fibreCoreUm: null, electrodeMaterial: 'Pt-Ir', electrodeAreaMm2: 0.03 });
  const admin = { labId: t.lab.id, userId: t.people.admin!.id, email: t.people.admin!.email };
  const token = await createRigToken(admin, { rigId: rig.id, name: `pc-${t.tag}`, expiresInDays: 30 });
  const v = await makeVersion({ labId: t.lab.id, rigId: rig.id, spec, status: 'approved', decidedBy: t.people.officer!.id, protocolName: `Files ${t.tag}` });
  const download = async (segment: string, headers: Record<string, string> = {}) => {
    const res = await getVersion(
      new Request(`http://pulseloom.test/api/rig/v1/versions/${segment}`, {
        headers: { authorization: `Bearer ${token.secret}`, 'x-forwarded-for': `10.200.0.${++ipSeq % 250}`, ...headers },
      }),
      { params: Promise.resolve({ id: segment }) },
    );
    expect(res.status).toBe(200);
    return { res, text: await res.text() };
  };
  return { ...t, rig, token, v, download };
}

function runCli(file: string) {
  return spawnSync(process.execPath, [join(root, 'bin/pulseloom.mjs'), 'verify', file], { encoding: 'utf8', timeout: 60_000 });
}

function tempFile(name: string, text: string) {
  const p = join(mkdtempSync(join(tmpdir(), 'pulseloom-rig-')), name);
  writeFileSync(p, text);
  return p;
}

describe('downloaded CSV', () => {
  it('has one row per pulse equal to the in-memory generator, a header with the manifest essentials, and verifies', async () => {
    const spec = exampleSpec('electrical-biphasic', { trials: 3, seed: `files-${Date.now()}` });
    const s = await setup(spec, 'electrical');
    const { text } = await s.download(`${s.v.version.id}.csv`);

    const lines = text.split('\n');
    const comments = Object.fromEntries(
      lines.filter((l) => l.startsWith('# ') && l.includes(': ')).map((l) => [l.slice(2, l.indexOf(': ')), l.slice(l.indexOf(': ') + 2)]),
    );
    expect(lines[0]).not.toContain('PREVIEW');
    expect(comments).toMatchObject({
      format: 'pulseloom-schedule/1',
      protocol: `Files ${s.tag}`,
      version: '1',
      status: 'approved',
      seed: spec.seed,
      clockHz: String(spec.clockHz),
      checksum: s.v.checksum,
      approvedBy: `${`officer ${s.tag}`} <${s.people.officer!.email}>`,
      approvedAt: s.v.version.decidedAt!.toISOString(),
    });

    // Rows against generateSchedule (whole schedule in memory, a different path through the engine).
    const mem = generateSchedule(spec);
    const header = lines.findIndex((l) => l === CSV_HEADER);
    expect(header).toBeGreaterThan(0);
    const rows = lines.slice(header + 1).filter(Boolean).map((l) => l.split(','));
    expect(rows.length).toBe(mem.trials.reduce((n, t) => n + t.onsetSamples.length, 0));
    let k = 0;
    for (const t of mem.trials) {
      for (let i = 0; i < t.onsetSamples.length; i++, k++) {
        const r = rows[k]!;
        expect([Number(r[0]), Number(r[1]), Number(r[2]), Number(r[3])]).toEqual([t.trial, i, t.onsetsS[i], t.onsetSamples[i]]);
      }
    }
    // Electrical rows carry width, amplitude with unit, both phase widths, gap and polarity.
    expect(rows[0]!.slice(4, 10)).toEqual(['0.45', '60', 'uA', '200', '50', 'cathodic']);

    expect(verifySchedule(text)).toEqual({ ok: true, pulses: rows.length, checksum: s.v.checksum, preview: false });
    const cli = runCli(tempFile('approved.csv', text));
    expect(cli.status, cli.stderr).toBe(0);
    const tampered = text.replace(/\n0,0,([^,]+),(\d+),/, (_m, s1: string, n: string) => `\n0,0,${s1},${Number(n) + 1},`);
    expect(tampered).not.toBe(text);
    expect(runCli(tempFile('tampered.csv', tampered)).status).toBe(1);
  });

  it.runIf(hasPython)('passes the Python example script’s own checksum (standard library, documented serialization)', async () => {
    const s = await setup(smallSpec());
    const { text } = await s.download(`${s.v.version.id}.csv`);
    const ok = spawnSync('python3', [join(root, 'docs/examples/rig_fetch.py'), '--file', tempFile('rig.csv', text), '--clock-hz', '10000'], { encoding: 'utf8' });
    expect(ok.status, ok.stderr).toBe(0);
    expect(ok.stdout).toContain(`checksum ${s.v.checksum}`);
    const wrongClock = spawnSync('python3', [join(root, 'docs/examples/rig_fetch.py'), '--file', tempFile('rig.csv', text), '--clock-hz', '20000'], { encoding: 'utf8' });
    expect(wrongClock.status).toBe(1);
  });
});

describe('downloaded JSON', () => {
  it('holds the manifest and the trials of the engine, and verifies', async () => {
    const spec = exampleSpec('optical-ramp-sine', { trials: 2, seed: `json-${Date.now()}` });
    const s = await setup(spec);
    const { text } = await s.download(`${s.v.version.id}.json`);
    const doc = JSON.parse(text) as {
      format: string;
      preview?: boolean;
      meta: Record<string, unknown>;
      manifest: { checksum: string; spec: Spec; pulseCount: number };
      trials: { trial: number; onsetsS: number[]; onsetSamples: number[] }[];
    };
    expect(doc.format).toBe('pulseloom-schedule/1');
    expect(doc.preview).toBeUndefined();
    expect(doc.meta).toMatchObject({ protocol: `Files ${s.tag}`, version: 1, status: 'approved' });
    expect(doc.manifest.checksum).toBe(s.v.checksum);
    const mem = generateSchedule(spec);
    expect(doc.trials.map((t) => t.onsetSamples)).toEqual(mem.trials.map((t) => t.onsetSamples));
    expect(doc.trials.map((t) => t.onsetsS)).toEqual(mem.trials.map((t) => t.onsetsS));
    expect(verifySchedule(text).ok).toBe(true);
    expect(runCli(tempFile('approved.json', text)).status).toBe(0);
  });
});

describe('cache of approved files', () => {
  it('answers a repeat download from memory with the same bytes', async () => {
    const s = await setup(smallSpec());
    const first = await s.download(`${s.v.version.id}.csv`);
    expect(first.res.headers.get('content-length')).toBeNull(); // streamed while rendering
    const hits = scheduleCache.hits;
    const second = await s.download(`${s.v.version.id}.csv`);
    expect(scheduleCache.hits).toBe(hits + 1);
    expect(second.res.headers.get('content-length')).toBe(String(Buffer.byteLength(second.text)));
    expect(second.text).toBe(first.text);
  });
});

describe('exports from the app', () => {
  const actorOf = (s: Awaited<ReturnType<typeof setup>>, who: 'exp' | 'officer') => ({
    labId: s.lab.id,
    userId: s.people[who]!.id,
    email: s.people[who]!.email,
    ip: '127.0.0.1',
  });
  const exportReq = (id: string, format: string) => new Request(`http://pulseloom.test/api/versions/${id}/export?format=${format}`);

  it('refuse with 409 until the cautions are acknowledged; the acknowledgement is audited once', async () => {
    const s = await setup(smallSpec());
    const exp = actorOf(s, 'exp');
    const refused = await exportVersionFile(exp, exportReq(s.v.version.id, 'csv'), s.v.version.id, 'csv').catch((e: unknown) => e);
    expect(refused).toBeInstanceOf(AppError);
    expect((refused as AppError).status).toBe(409);

    expect((await acknowledgeCautions(exp, s.v.version.id)).recorded).toBe(true);
    expect((await acknowledgeCautions(exp, s.v.version.id)).recorded).toBe(false);
    const audits = await db
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.action, 'export.cautions_acknowledged'), eq(auditLog.subjectId, s.v.version.id)));
    expect(audits).toHaveLength(1);
    expect(audits[0]!.actorUserId).toBe(exp.userId);
    expect((audits[0]!.details as { cautions: string[] }).cautions).toEqual(['light-heat', 'laser-eye', 'measure-output', 'approval']);

    // Acknowledged by the experimenter only: the officer still has to read them.
    const officer = await exportVersionFile(actorOf(s, 'officer'), exportReq(s.v.version.id, 'csv'), s.v.version.id, 'csv').catch((e: unknown) => e);
    expect((officer as AppError).status).toBe(409);
  });

  it('give an approved version the very bytes the rig gets', async () => {
    const s = await setup(smallSpec());
    const exp = actorOf(s, 'exp');
    await acknowledgeCautions(exp, s.v.version.id);
    for (const format of ['csv', 'json'] as const) {
      const app = await exportVersionFile(exp, exportReq(s.v.version.id, format), s.v.version.id, format);
      const rig = await s.download(`${s.v.version.id}.${format}`);
      expect(await app.text()).toBe(rig.text);
      expect(app.headers.get('content-disposition')).toBe(rig.res.headers.get('content-disposition'));
    }
    const exported = await db.select().from(auditLog).where(and(eq(auditLog.action, 'version.exported'), eq(auditLog.subjectId, s.v.version.id)));
    expect(exported).toHaveLength(2);
  });

  it('mark drafts as previews in the file name, the CSV header and the JSON', async () => {
    const s = await setup(smallSpec());
    const draft = await makeVersion({ labId: s.lab.id, rigId: s.rig.id, spec: smallSpec(), status: 'draft', protocolName: `Draft ${s.tag}` });
    const exp = actorOf(s, 'exp');
    await acknowledgeCautions(exp, draft.version.id);

    const csv = await exportVersionFile(exp, exportReq(draft.version.id, 'csv'), draft.version.id, 'csv');
    expect(csv.headers.get('content-disposition')).toMatch(/^attachment; filename="PREVIEW_draft-[0-9a-f]{8}_v1_[0-9a-f]{12}\.csv"$/);
    expect(csv.headers.get('etag')).toBeNull();
    const text = await csv.text();
    expect(text.split('\n')[0]).toBe(`# ${PREVIEW_NOTICE}`);
    expect(text).toContain('# status: draft');
    expect(verifySchedule(text)).toMatchObject({ ok: true, preview: true });

    const json = JSON.parse(await (await exportVersionFile(exp, exportReq(draft.version.id, 'json'), draft.version.id, 'json')).text()) as Record<string, unknown>;
    expect(json.preview).toBe(true);
    expect(json.notice).toBe('PREVIEW — NOT APPROVED FOR USE');

    // And the rig API never serves it.
    const viaRig = await getVersion(
      new Request(`http://pulseloom.test/api/rig/v1/versions/${draft.version.id}.csv`, { headers: { authorization: `Bearer ${s.token.secret}` } }),
      { params: Promise.resolve({ id: `${draft.version.id}.csv` }) },
    );
    expect(viaRig.status).toBe(404);
  });

  it('do not reach another lab’s version', async () => {
    const s = await setup(smallSpec());
    const other = await setup(smallSpec());
    const err = await acknowledgeCautions(actorOf(s, 'exp'), other.v.version.id).catch((e: unknown) => e);
    expect((err as AppError).status).toBe(404);
    const exp = await exportVersionFile(actorOf(s, 'exp'), exportReq(other.v.version.id, 'csv'), other.v.version.id, 'csv').catch((e: unknown) => e);
    expect((exp as AppError).status).toBe(404);
  });
});
