import { describe, expect, it } from 'vitest';
import { ByteLru } from '@/lib/rig-api/cache';
import { byteStream, cachedScheduleBody, scheduleChunks } from '@/lib/rig-api/render';
import { csvLines, scanSchedule, type Spec } from '@/lib/schedule';
import { vi } from 'vitest';

const bytes = (n: number) => new Uint8Array(n);

async function readAll(s: ReadableStream<Uint8Array>): Promise<string> {
  return new Response(s).text();
}

const spec: Spec = {
  format: 'pulseloom-spec/1',
  envelope: [{ kind: 'ramp', durationS: 130, fromHz: 5, toHz: 15 }],
  ceilingHz: 20,
  refractory: { absoluteMs: 5, recoveryMs: 0 },
  pulse: { widthMs: 2, amplitude: 3, unit: 'mW' },
  trials: 3,
  seed: 'cache-test',
  clockHz: 10_000,
};

describe('byte LRU', () => {
  it('evicts the least recently used entries to stay under its byte budget', () => {
    const c = new ByteLru(100, 60);
    c.set('a', bytes(40));
    c.set('b', bytes(40));
    c.get('a'); // a is now the most recent
    c.set('c', bytes(40));
    expect(c.get('b')).toBeUndefined();
    expect(c.get('a')).toBeDefined();
    expect(c.get('c')).toBeDefined();
    expect(c.totalBytes).toBe(80);
  });

  it('keeps nothing over the per-entry limit', () => {
    const c = new ByteLru(1000, 60);
    expect(c.set('big', bytes(61))).toBe(false);
    expect(c.size).toBe(0);
  });
});

describe('schedule byte stream', () => {
  it('gives exactly the engine’s CSV text, across several 64 KB pieces', async () => {
    const want = [...csvLines(spec, { protocol: 'p' })].join('');
    expect(want.length).toBeGreaterThan(64 * 1024);
    expect(await readAll(byteStream(scheduleChunks(spec, { protocol: 'p' }, 'csv')))).toBe(want);
  });

  it('fills the cache after a complete read, and not for files over the per-entry limit', async () => {
    const small = new ByteLru(10_000_000, 10_000_000);
    const first = cachedScheduleBody('k', () => scheduleChunks(spec, {}, 'json'), small);
    expect(first.fromCache).toBe(false);
    const text = await readAll(first.body as ReadableStream<Uint8Array>);
    const second = cachedScheduleBody('k', () => {
      throw new Error('must not render again');
    }, small);
    expect(second.fromCache).toBe(true);
    expect(new TextDecoder().decode(second.body as Uint8Array)).toBe(text);

    const tiny = new ByteLru(10_000_000, 1000);
    await readAll(cachedScheduleBody('k', () => scheduleChunks(spec, {}, 'json'), tiny).body as ReadableStream<Uint8Array>);
    expect(tiny.size).toBe(0);
  });

  it('does not cache a download the client abandoned', async () => {
    const c = new ByteLru(10_000_000, 10_000_000);
    const body = cachedScheduleBody('k', () => scheduleChunks(spec, {}, 'csv'), c).body as ReadableStream<Uint8Array>;
    const reader = body.getReader();
    await reader.read();
    await reader.cancel();
    expect(c.size).toBe(0);
  });

  it('with the stored checksum and count: the same bytes in one pass, cached', async () => {
    const c = new ByteLru(10_000_000, 10_000_000);
    const known = scanSchedule(spec);
    for (const format of ['csv', 'json'] as const) {
      const want = await readAll(byteStream(scheduleChunks(spec, { protocol: 'p' }, format)));
      const body = cachedScheduleBody(format, () => scheduleChunks(spec, { protocol: 'p' }, format, known), c).body;
      expect(await readAll(body as ReadableStream<Uint8Array>)).toBe(want);
    }
    expect(c.size).toBe(2);
  });

  it('errors, unfinished and uncached, when the pulses differ from the stored checksum', async () => {
    const c = new ByteLru(10_000_000, 10_000_000);
    const wrong = { checksum: `sha256:${'f'.repeat(64)}`, pulseCount: scanSchedule(spec).pulseCount };
    const logged = vi.spyOn(console, 'error').mockImplementation(() => {});
    const body = cachedScheduleBody('k', () => scheduleChunks(spec, {}, 'csv', wrong), c).body as ReadableStream<Uint8Array>;
    await expect(readAll(body)).rejects.toThrow(/differs from the stored one/);
    expect(c.size).toBe(0);
    expect(logged).toHaveBeenCalled();
    logged.mockRestore();
  });
});
