import { expect, test } from '@playwright/test';
import { readFile } from 'node:fs/promises';
import Papa from 'papaparse';
import { DEMO, signInWithPassword } from './support/auth';

// Ridgeway (the second demo lab) has no electrical rig and no electrical profile, so
// the profile this test creates, edits and deletes changes no other test's sheets.

test('a safety officer creates and edits a limit profile, sees it saved, and finds both changes in the audit log and its CSV', async ({ page }) => {
  const name = `Ridgeway electrical ${Date.now()}`;
  await signInWithPassword(page, DEMO.otherLab);
  await page.getByRole('navigation', { name: 'Lab sections' }).getByRole('link', { name: 'Limits' }).click();
  await expect(page.getByRole('heading', { name: 'Limits', level: 1 })).toBeVisible();
  await page.getByRole('link', { name: 'New electrical profile' }).click();

  await page.getByRole('button', { name: 'Fill in demo values' }).click();
  await page.getByLabel('Name').fill(name);
  // A warning level above the hard limit is refused by the shared schema, next to the box.
  await page.getByLabel('Charge per phase, warning level').fill('150');
  await page.getByRole('button', { name: 'Create profile' }).click();
  await expect(page.locator('#f-limits-maxChargePerPhaseNc-warn-err')).toHaveText('The warning level must not be above the hard limit.');
  await page.getByLabel('Charge per phase, warning level').fill('30');
  await page.getByRole('button', { name: 'Create profile' }).click();

  await expect(page).toHaveURL(/\/limits$/);
  const table = page.getByTestId('limits-table-electrical');
  await expect(table.getByRole('link', { name, exact: true })).toBeVisible();
  await table.getByRole('link', { name: `Edit ${name}` }).click();

  const hard = page.getByLabel('Charge per phase, hard limit');
  await expect(hard).toHaveValue('100');
  await hard.fill('80');
  // Emptying both boxes leaves the metric unchecked.
  await page.getByLabel('Train duration, warning level').fill('');
  await page.getByLabel('Train duration, hard limit').fill('');
  await page.getByRole('button', { name: 'Save limits' }).click();
  await expect(page.getByTestId('limits-status')).toHaveText('Saved. New safety sheets use these limits.');

  await page.reload();
  await expect(page.getByLabel('Charge per phase, hard limit')).toHaveValue('80');
  await expect(page.getByLabel('Train duration, hard limit')).toHaveValue('');
  await expect(page.getByLabel('Shannon k, hard limit')).toHaveValue('1.75');

  // The audit page, filtered to this officer's limit edits.
  await page.goto('/audit');
  await page.getByLabel('Action').selectOption('limits.updated');
  await page.getByLabel('Actor').fill('ines.okafor');
  await page.getByRole('button', { name: 'Apply' }).click();
  await expect(page).toHaveURL(/action=limits.updated/);
  const rows = page.getByTestId('audit-table').locator('tbody tr');
  const shown = await rows.count();
  expect(shown).toBeGreaterThan(0);
  for (let i = 0; i < shown; i++) {
    await expect(rows.nth(i)).toContainText('limits.updated');
    await expect(rows.nth(i)).toContainText(DEMO.otherLab);
  }
  await expect(page.getByTestId('audit-count')).toContainText(`${shown} ${shown === 1 ? 'entry' : 'entries'}`);

  const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('audit-csv').click()]);
  expect(download.suggestedFilename()).toMatch(/^pulseloom-audit-ridgeway-\d{4}-\d{2}-\d{2}\.csv$/);
  const csv = await readFile((await download.path())!, 'utf8');
  expect(csv.split('\r\n')[0]).toBe('id,at,actor,actor_user_id,actor_token_id,action,subject_type,subject_id,checksum,ip,details');
  const parsed = Papa.parse<Record<string, string>>(csv.trimEnd(), { header: true, newline: '\r\n' });
  expect(parsed.errors).toEqual([]);
  expect(parsed.data).toHaveLength(shown);
  for (const r of parsed.data) {
    expect([r.actor, r.action, r.subject_type]).toEqual([DEMO.otherLab, 'limits.updated', 'limit_profile']);
  }
  // The edit itself is in the file, with the new limit in its details.
  const edit = parsed.data.map((r) => JSON.parse(r.details!)).find((d) => d.after?.name === name);
  expect(edit.before.limits.maxChargePerPhaseNc).toEqual({ warn: 30, hard: 100 });
  expect(edit.after.limits.maxChargePerPhaseNc).toEqual({ warn: 30, hard: 80 });
  expect(edit.after.limits.maxTrainDurationS).toBeUndefined();

  // Clean up through the page: the delete asks twice.
  await page.goto('/limits');
  await page.getByRole('button', { name: `Delete ${name}` }).click();
  await page.getByRole('button', { name: 'Confirm delete' }).click();
  await expect(page.getByTestId('limits-table-electrical')).toHaveCount(0);
});

test('an experimenter gets a 403 on the limits pages and the audit export', async ({ page }) => {
  await signInWithPassword(page, DEMO.experimenter);
  const res = await page.goto('/limits');
  expect(res?.status()).toBe(403);
  await expect(page.getByRole('heading', { name: 'Not for your role' })).toBeVisible();
  expect((await page.goto('/limits/new?modality=optical'))?.status()).toBe(403);
  expect((await page.goto('/audit'))?.status()).toBe(403);
  const csv = await page.request.get('/api/audit/export');
  expect(csv.status()).toBe(403);
  expect((await csv.json()).error.code).toBe('forbidden');
});

test('the audit export refuses bad filters with the field and reason, and needs a session', async ({ page, playwright }) => {
  await signInWithPassword(page, DEMO.admin);
  const bad = await page.request.get('/api/audit/export?from=2031-13-01&to=2031-01-01');
  expect(bad.status()).toBe(400);
  const body = await bad.json();
  expect(body.error.issues.map((i: { path: string }) => i.path)).toContain('from');

  const ok = await page.request.get('/api/audit/export?subjectType=no-such-subject');
  expect(ok.status()).toBe(200);
  expect(ok.headers()['content-type']).toMatch(/^text\/csv/);
  expect(ok.headers()['content-disposition']).toMatch(/^attachment; filename="pulseloom-audit-harbor-lane-/);
  expect(await ok.text()).toBe('id,at,actor,actor_user_id,actor_token_id,action,subject_type,subject_id,checksum,ip,details\r\n');

  const anonymous = await playwright.request.newContext({ baseURL: new URL(page.url()).origin });
  expect((await anonymous.get('/api/audit/export')).status()).toBe(401);
  await anonymous.dispose();
});
