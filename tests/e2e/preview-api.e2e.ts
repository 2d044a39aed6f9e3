import { expect, test } from '@playwright/test';
import optical from '../../lib/schedule/examples/optical-ramp-sine.json' with { type: 'json' };
import { DEMO, signInWithPassword } from './support/auth';

test('the preview route needs a session', async ({ request }) => {
  const res = await request.post('/api/preview', { data: { spec: optical } });
  expect(res.status()).toBe(401);
  expect((await res.json()).error.code).toBe('unauthenticated');
});

test('the preview route answers bad specs with 400, each JSON path and its reason', async ({ page }) => {
  await signInWithPassword(page, DEMO.experimenter);
  const bad = {
    ...optical,
    ceilingHz: 20,
    envelope: [{ kind: 'ramp', durationS: 10, fromHz: -1, toHz: 30 }],
  };
  const res = await page.request.post('/api/preview', { data: { spec: bad, trials: 3 } });
  expect(res.status()).toBe(400);
  const body = await res.json();
  const paths = body.errors.map((e: { path: string }) => e.path);
  expect(paths).toEqual(expect.arrayContaining(['envelope[0].fromHz']));
  expect(body.errors.every((e: { message: string }) => e.message.length > 0)).toBe(true);

  const notJson = await page.request.post('/api/preview', { headers: { 'content-type': 'application/json' }, data: '{"spec":' });
  expect(notJson.status()).toBe(400);

  const tooMany = await page.request.post('/api/preview', { data: { spec: optical, trials: 500 } });
  expect(tooMany.status()).toBe(400);
  expect((await tooMany.json()).errors[0].path).toBe('trials');
});

test('a valid spec previews the requested trials with the seed in use', async ({ page }) => {
  await signInWithPassword(page, DEMO.officer);
  const res = await page.request.post('/api/preview', { data: { spec: optical, trials: 4 } });
  expect(res.status()).toBe(200);
  const body = await res.json();
  expect(body.seed).toBe(optical.seed);
  expect(body.trials).toBe(4);
  expect(body.onsetsS).toHaveLength(4);
  for (const row of body.onsetsS as number[][]) {
    expect(row.length).toBeGreaterThan(0);
    expect([...row].sort((x, y) => x - y)).toEqual(row); // onsets in time order
  }
});
