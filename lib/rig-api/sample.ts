/**
 * The public sample schedule: a fixed, invented protocol that anyone writing a rig
 * script can fetch without a token to try their parser and checksum code. It is marked
 * PREVIEW — NOT APPROVED FOR USE like any unapproved file, and it touches no database.
 * About 10,000 pulses (10 trials × 100 s around 10 Hz), the size of a typical session.
 */
import { scanSchedule, type Spec } from '@/lib/schedule';
import { MEDIA_TYPES, contentDisposition, entityTag, ifNoneMatchHits, scheduleFileName, type ScheduleFormat } from './format';
import { scheduleChunks } from './render';

export const SAMPLE_SPEC: Spec = {
  format: 'pulseloom-spec/1',
  envelope: [
    { kind: 'ramp', durationS: 10, fromHz: 2, toHz: 10 },
    { kind: 'sine', durationS: 90, meanHz: 10.5, depthHz: 8, freqHz: 0.1, phaseDeg: 0 },
  ],
  ceilingHz: 20,
  refractory: { absoluteMs: 10, recoveryMs: 0 },
  pulse: { widthMs: 5, amplitude: 5, unit: 'mW' },
  trials: 10,
  seed: 'pulseloom-sample-1',
  clockHz: 10_000,
};

export const SAMPLE_META = { preview: true, protocol: 'Pulseloom sample', version: 1, status: 'sample' } as const;

type Rendered = { bytes: Uint8Array; etag: string; fileName: string };
const rendered = new Map<ScheduleFormat, Rendered>();
let checksum: string | null = null;

/** Rendered on first use and kept: the sample never changes within a release. */
export function sampleFile(format: ScheduleFormat): Rendered {
  let r = rendered.get(format);
  if (!r) {
    checksum ??= scanSchedule(SAMPLE_SPEC).checksum;
    const bytes = Buffer.concat([...scheduleChunks(SAMPLE_SPEC, { ...SAMPLE_META }, format)]);
    r = {
      bytes,
      etag: entityTag(checksum),
      fileName: scheduleFileName({ protocol: 'sample', version: 1, checksum, format, preview: true }),
    };
    rendered.set(format, r);
  }
  return r;
}

export function sampleResponse(request: Request, format: ScheduleFormat): Response {
  const f = sampleFile(format);
  const headers: Record<string, string> = { ETag: f.etag, 'Cache-Control': 'public, max-age=3600' };
  if (ifNoneMatchHits(request.headers.get('if-none-match'), f.etag)) return new Response(null, { status: 304, headers });
  return new Response(f.bytes as BodyInit, {
    status: 200,
    headers: {
      ...headers,
      'Content-Type': MEDIA_TYPES[format],
      'Content-Length': String(f.bytes.byteLength),
      'Content-Disposition': contentDisposition(f.fileName),
      'X-Content-Type-Options': 'nosniff',
    },
  });
}
