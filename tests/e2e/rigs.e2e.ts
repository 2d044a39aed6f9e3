import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { expect, test, type Page } from '@playwright/test';
import { DEMO, signInWithPassword } from './support/auth';
import { BENCH_2, auditActions, makeRigVersions } from './support/rig-data';

// Playwright runs from the repository root (scripts/test.mjs).
const root = process.cwd();
const tag = `${Date.now().toString(36)}${Math.floor(Math.random() * 1e4)}`;
let data: Awaited<ReturnType<typeof makeRigVersions>>;

test.beforeAll(async () => {
  data = await makeRigVersions(tag);
});

async function openBench2(page: Page) {
  await page.goto('/rigs');
  await page.getByRole('link', { name: BENCH_2 }).click();
  await expect(page.getByRole('heading', { level: 1, name: BENCH_2 })).toBeVisible();
}

test('a lab admin creates a rig token, sees the secret once, the rig uses it, and revoking stops it', async ({ page, baseURL }) => {
  await signInWithPassword(page, DEMO.admin);
  await openBench2(page);
  const tokenName = `acquisition PC ${tag}`;
  const form = page.getByRole('form', { name: 'Create a token' });
  await form.getByLabel('Token name').fill(tokenName);
  await form.getByLabel('Expires in (days)').fill('30');
  await form.getByRole('button', { name: 'Create token' }).click();

  const dialog = page.getByRole('dialog', { name: `Token “${tokenName}” created` });
  await expect(dialog).toBeVisible();
  const secret = await dialog.getByTestId('token-secret').inputValue();
  expect(secret).toMatch(/^plr_[A-Za-z0-9_-]{43}$/);
  await dialog.getByRole('button', { name: 'I have stored it' }).click();
  await expect(dialog).toBeHidden();

  const row = page.getByTestId('token-row').filter({ hasText: tokenName });
  await expect(row).toContainText('active');
  await page.reload();
  await expect(page.getByTestId('token-row').filter({ hasText: tokenName })).toBeVisible();
  expect(await page.content()).not.toContain(secret.slice(4));

  // The rig PC: no session, only the token in the header.
  const rig = await page.context().browser()!.newContext({ baseURL });
  const listing = await rig.request.get('/api/rig/v1/versions', { headers: { Authorization: `Bearer ${secret}` } });
  expect(listing.status()).toBe(200);
  const body = (await listing.json()) as { versions: { id: string; checksum: string }[] };
  expect(body.versions.find((v) => v.id === data.approvedId)?.checksum).toBe(data.checksum);
  expect(body.versions.some((v) => v.id === data.draftId)).toBe(false);

  // The documented Python rig script, run against this server.
  const py = spawnSync('python3', ['--version']);
  if (py.status === 0) {
    const out = mkdtempSync(join(tmpdir(), 'pulseloom-rig-e2e-'));
    const run = () =>
      spawnSync('python3', [join(root, 'docs/examples/rig_fetch.py'), '--version', data.approvedId, '--out', out, '--pulses', '3'], {
        encoding: 'utf8',
        env: { ...process.env, PULSELOOM_URL: baseURL!, PULSELOOM_TOKEN: secret },
      });
    const first = run();
    expect(first.status, first.stderr).toBe(0);
    expect(first.stdout).toContain(`checksum ${data.checksum}`);
    expect(first.stdout).toMatch(/^\s+0\s+0\s+\S+\s+\d+\s+10\s+3 mW/m);
    const second = run();
    expect(second.stdout).toContain('304 Not Modified');
    const actions = (await auditActions(data.approvedId)).filter((a) => a.actor_label === `token ${tokenName}`).map((a) => a.action);
    expect(actions).toEqual(['rig.version_downloaded', 'rig.version_unchanged']);
  }

  // Used a moment ago (so the server remembers the token), then revoked: refused at once.
  expect((await rig.request.get('/api/rig/v1/versions', { headers: { Authorization: `Bearer ${secret}` } })).status()).toBe(200);
  page.once('dialog', (d) => d.accept());
  await page.getByRole('button', { name: `Revoke ${tokenName}` }).click();
  await expect(page.getByTestId('token-row').filter({ hasText: tokenName })).toContainText('revoked');
  const refused = await rig.request.get('/api/rig/v1/versions', { headers: { Authorization: `Bearer ${secret}` } });
  expect(refused.status()).toBe(401);
  await rig.close();
});

test('an experimenter acknowledges the cautions once, then downloads the approved schedule', async ({ page }) => {
  await signInWithPassword(page, DEMO.experimenter);
  await openBench2(page);
  const item = page.getByTestId('approved-version').filter({ hasText: data.protocolName });
  await item.getByText(`Export ${data.protocolName} v1`).click();
  const panel = item.getByTestId('export-panel');
  await expect(panel.getByText('Light heats tissue')).toBeVisible();
  await expect(panel.getByText('Laser eye safety')).toBeVisible();
  await expect(panel.getByRole('link', { name: 'Download CSV' })).toHaveCount(0);

  const ack = panel.getByRole('button', { name: 'I acknowledge' });
  await expect(ack).toBeDisabled();
  // Keyboard only: focus the checkbox, tick it with Space, then press the button with Enter.
  await panel.getByRole('checkbox').focus();
  await page.keyboard.press('Space');
  await ack.focus();
  await page.keyboard.press('Enter');

  const [download] = await Promise.all([page.waitForEvent('download'), panel.getByRole('link', { name: 'Download CSV' }).click()]);
  const hex12 = data.checksum.slice(7, 19);
  expect(download.suggestedFilename()).toBe(`rig-test-protocol-${tag}_v1_${hex12}.csv`);
  const file = join(mkdtempSync(join(tmpdir(), 'pulseloom-export-')), download.suggestedFilename());
  await download.saveAs(file);
  expect(readFileSync(file, 'utf8')).toContain(`# checksum: ${data.checksum}`);
  const verify = spawnSync(process.execPath, [join(root, 'bin/pulseloom.mjs'), 'verify', file], { encoding: 'utf8' });
  expect(verify.status, verify.stderr + verify.stdout).toBe(0);

  // Once per version: after a reload the links are there without asking again.
  await page.reload();
  const again = page.getByTestId('approved-version').filter({ hasText: data.protocolName });
  await again.getByText(`Export ${data.protocolName} v1`).click();
  await expect(again.getByRole('link', { name: 'Download JSON' })).toBeVisible();
  await expect(again.getByRole('button', { name: 'I acknowledge' })).toHaveCount(0);
  const actions = (await auditActions(data.approvedId)).map((a) => a.action);
  expect(actions.filter((a) => a === 'export.cautions_acknowledged')).toHaveLength(1);
  expect(actions).toContain('version.exported');
});

test('a draft exports only as a file marked PREVIEW — NOT APPROVED FOR USE', async ({ page }) => {
  await signInWithPassword(page, DEMO.officer);
  await openBench2(page);
  const item = page.getByTestId('unapproved-version').filter({ hasText: `${data.protocolName} — version 2` });
  await item.getByText(`Preview export ${data.protocolName} v2`).click();
  const panel = item.getByTestId('export-panel');
  await expect(panel.getByTestId('preview-label')).toHaveText('PREVIEW — NOT APPROVED FOR USE');

  // Before acknowledging, the server refuses too (not only the panel).
  const early = await page.request.get(`/api/versions/${data.draftId}/export?format=csv`);
  expect(early.status()).toBe(409);

  await panel.getByRole('checkbox').check();
  await panel.getByRole('button', { name: 'I acknowledge' }).click();
  const [download] = await Promise.all([page.waitForEvent('download'), panel.getByRole('link', { name: 'Download preview CSV' }).click()]);
  expect(download.suggestedFilename()).toMatch(new RegExp(`^PREVIEW_rig-test-protocol-${tag}_v2_[0-9a-f]{12}\\.csv$`));
  const file = join(mkdtempSync(join(tmpdir(), 'pulseloom-export-')), 'preview.csv');
  await download.saveAs(file);
  expect(readFileSync(file, 'utf8').split('\n')[0]).toBe('# PREVIEW — NOT APPROVED FOR USE');

  const json = await page.request.get(`/api/versions/${data.draftId}/export?format=json`);
  expect(json.status()).toBe(200);
  const doc = (await json.json()) as { preview: boolean; notice: string; meta: { status: string } };
  expect(doc).toMatchObject({ preview: true, notice: 'PREVIEW — NOT APPROVED FOR USE', meta: { status: 'draft' } });
});

test('a lab admin registers an electrical rig, edits it and archives it', async ({ page }) => {
  await signInWithPassword(page, DEMO.admin);
  await page.goto('/rigs');
  await page.getByRole('link', { name: 'Register a rig' }).click();
  const form = page.getByRole('form', { name: 'Register a rig' });
  const name = `Bench 9 — microstim ${tag}`;
  await form.getByLabel('Name').fill(name);
  await form.getByLabel('Electrical (current)').check();
  // The fields follow the modality.
  await expect(form.getByLabel('Wavelength (nm)')).toHaveCount(0);
  await form.getByLabel('Output sample clock (Hz)').fill('30000');
  await form.getByLabel('Electrode material').fill('platinum–iridium');
  await form.getByRole('button', { name: 'Register rig' }).click();
  await expect(form.getByText('Enter the geometric area')).toBeVisible();
  await expect(form.getByLabel('Geometric area (mm²)')).toHaveAttribute('aria-invalid', 'true');
  await form.getByLabel('Geometric area (mm²)').fill('0.0314');
  await form.getByRole('button', { name: 'Register rig' }).click();
  await expect(page.getByRole('heading', { level: 1, name })).toBeVisible();
  await expect(page.getByText('platinum–iridium, 0.0314 mm²')).toBeVisible();

  await page.getByRole('link', { name: 'Edit rig' }).click();
  await page.getByLabel('Output sample clock (Hz)').fill('25000');
  await page.getByRole('button', { name: 'Save rig' }).click();
  await expect(page.getByRole('heading', { level: 1, name })).toBeVisible();
  await expect(page.getByText('25,000 Hz')).toBeVisible();

  page.once('dialog', (d) => d.accept());
  await page.getByRole('button', { name: 'Archive rig' }).click();
  await expect(page.getByText(/^Archived \d{4}-\d{2}-\d{2}/)).toBeVisible();
  await page.goto('/rigs');
  await expect(page.getByRole('table').getByRole('link', { name })).toHaveCount(0);
  await expect(page.getByRole('region', { name: 'Archived rigs' }).getByRole('link', { name })).toBeVisible();
});
