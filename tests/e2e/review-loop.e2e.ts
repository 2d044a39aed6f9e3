import { expect, test, type Page } from '@playwright/test';
import { DEMO, signInWithPassword, signOut } from './support/auth';

/** Waits for the fake SMTP server to have delivered a message, and returns it. */
async function mail(page: Page, to: string, subject: string) {
  const item = page.getByTestId('mail').filter({ has: page.getByTestId('mail-to').getByText(to, { exact: true }) }).filter({
    has: page.getByTestId('mail-subject').getByText(subject, { exact: true }),
  });
  await expect(async () => {
    await page.goto('/dev/mailbox');
    await expect(item.first()).toBeVisible({ timeout: 1000 });
  }).toPass({ timeout: 30_000 });
  return item.first();
}

const badge = (page: Page) => page.getByTestId('version-status').first();

test('submit, return with a comment, version 2, approve — and both decisions arrive by e-mail', async ({ page }) => {
  test.setTimeout(180_000);
  const name = `Loop ${Date.now()}`;

  // ── The experimenter creates a protocol; version 1 is a draft on Bench 2 with its clock.
  await signInWithPassword(page, DEMO.experimenter);
  await page.goto('/protocols/new');
  const form = page.getByRole('form', { name: 'New protocol' });
  await form.getByLabel('Name').fill(name);
  await form.getByLabel('Purpose').fill('Browser test of the review loop.');
  await form.getByLabel('Target').fill('dorsal CA1, left');
  await form.getByLabel(/Bench 2 — blue light/).check();
  await page.getByRole('button', { name: 'Create protocol' }).click();
  await expect(page).toHaveURL(/\/protocols\/[0-9a-f-]{36}\/versions\/1$/);
  const v1Url = page.url();
  const protocolUrl = v1Url.replace(/\/versions\/1$/, '');
  await expect(badge(page)).toHaveText('Draft');
  await expect(page.getByTestId('version-facts')).toContainText('Bench 2 — blue light — 10,000 Hz clock');
  await expect(page.getByLabel('Output clock (Hz)')).toHaveValue('10000');

  // The example's 180 s trains are over the lab's 60 s warning level: a justification is asked for.
  const submit = page.getByRole('form', { name: 'Submit for review' });
  await submit.getByRole('button', { name: 'Submit for review' }).click();
  await expect(submit.locator('#submit-justification-err')).toHaveText('Write why the warning-level values are needed');
  await submit.getByLabel('Justification for the warnings').fill('Three-minute trains cover one lap of the track.');
  await submit.getByRole('button', { name: 'Submit for review' }).click();
  await expect(badge(page)).toHaveText('In review');
  await expect(page.getByTestId('checksum')).toHaveText(/^sha256:[0-9a-f]{64}$/);
  await signOut(page);

  // ── The officer finds it in the queue and returns it with a comment.
  await signInWithPassword(page, DEMO.officer);
  await page.goto('/reviews');
  const row = page.getByTestId('review-queue').getByRole('row').filter({ hasText: name });
  await expect(row).toContainText('v1');
  await expect(row).toContainText('Bench 2 — blue light');
  await row.getByRole('link', { name }).click();
  await expect(page.getByRole('heading', { name: `Review: ${name} v1` })).toBeVisible();
  await expect(page.getByTestId('safety-sheet')).toBeVisible();
  await expect(page.getByText('Three-minute trains cover one lap of the track.')).toBeVisible();
  const decision = page.getByRole('form', { name: 'Decision' });
  await decision.getByLabel('Return with comments').check();
  await decision.getByRole('button', { name: 'Return to the author' }).click();
  await expect(decision.locator('#decision-comment-err')).toHaveText('Say what needs to change before it can be approved');
  await decision.getByLabel('What needs to change').fill('Lower the mean of the last section to 8 Hz.');
  await decision.getByRole('button', { name: 'Return to the author' }).click();
  await expect(badge(page)).toHaveText('Returned');
  await signOut(page);

  // ── The experimenter copies it into version 2, with the comment beside the editor, and changes the spec.
  await signInWithPassword(page, DEMO.experimenter);
  await page.goto(v1Url);
  await expect(badge(page)).toHaveText('Returned');
  await expect(page.getByTestId('comments')).toContainText('Lower the mean of the last section to 8 Hz.');
  await page.getByRole('button', { name: 'Copy into a new version' }).click();
  await expect(page).toHaveURL(/\/versions\/2$/);
  await expect(badge(page)).toHaveText('Draft');
  await expect(page.getByTestId('source-comments')).toContainText('Lower the mean of the last section to 8 Hz.');
  const mean = page.getByLabel('Segment 3 mean (Hz)', { exact: true });
  await mean.fill('8');
  await mean.press('Tab');
  await page.getByRole('button', { name: 'Save', exact: true }).click();
  await expect(page.getByText('Saved.')).toBeVisible();
  const submit2 = page.getByRole('form', { name: 'Submit for review' });
  await submit2.getByLabel('Justification for the warnings').fill('Three-minute trains cover one lap of the track.');
  await submit2.getByRole('button', { name: 'Submit for review' }).click();
  await expect(badge(page)).toHaveText('In review');
  await signOut(page);

  // ── The officer approves version 2.
  await signInWithPassword(page, DEMO.officer);
  await page.goto('/reviews');
  await page.getByTestId('review-queue').getByRole('row').filter({ hasText: name }).getByRole('link', { name }).click();
  await expect(page.getByRole('heading', { name: `Review: ${name} v2` })).toBeVisible();
  const decision2 = page.getByRole('form', { name: 'Decision' });
  await decision2.getByLabel('Comment (optional)').fill('Good.');
  await decision2.getByRole('button', { name: 'Approve this version' }).click();
  await expect(badge(page)).toHaveText('Approved');
  const checksum = await page.getByTestId('checksum').textContent();
  await expect(page.getByTestId('approved-checksum')).toHaveText(checksum!);

  // The comparison shows the changed parameter and pulses that moved only after 90 s.
  await page.goto(`${protocolUrl}/compare?a=1&b=2`);
  await expect(page.getByTestId('param-diff')).toContainText('envelope[2].meanHz');
  await expect(page.getByTestId('compare-summary')).toContainText(/\d+ pulses in both, \d+ only in v1, \d+ only in v2/);

  // ── Both decisions reached the author; the review requests reached the officer.
  await signOut(page);
  const returned = await mail(page, DEMO.experimenter, `Returned: ${name} v1`);
  await expect(returned.getByTestId('mail-text')).toContainText('Lower the mean of the last section to 8 Hz.');
  await expect(returned.getByRole('link')).toHaveAttribute('href', /\/protocols\/[0-9a-f-]{36}\/versions\/1$/);
  const approved = await mail(page, DEMO.experimenter, `Approved: ${name} v2`);
  await expect(approved.getByTestId('mail-text')).toContainText(checksum!);
  await expect(await mail(page, DEMO.officer, `Review requested: ${name} v2`)).toBeVisible();
});

test('an officer reviewing a version they submitted themselves sees why they cannot decide it', async ({ page }) => {
  // Inès is experimenter and safety officer in Ridgeway; whatever she submits, someone else decides.
  test.setTimeout(120_000);
  const name = `Own ${Date.now()}`;
  await signInWithPassword(page, DEMO.otherLab);
  await page.goto('/protocols/new');
  const form = page.getByRole('form', { name: 'New protocol' });
  await form.getByLabel('Name').fill(name);
  await form.getByLabel(/Whisker rig/).check();
  await page.getByRole('button', { name: 'Create protocol' }).click();
  await expect(page).toHaveURL(/\/versions\/1$/);
  const submit = page.getByRole('form', { name: 'Submit for review' });
  const justification = submit.getByLabel('Justification for the warnings');
  if (await justification.isVisible()) await justification.fill('Needed for the test.');
  await submit.getByRole('button', { name: 'Submit for review' }).click();
  await expect(badge(page)).toHaveText('In review');
  await page.getByRole('link', { name: 'Open the review' }).click();
  await expect(page.getByTestId('own-version')).toContainText('another safety officer of the lab must decide it');
  await expect(page.getByRole('form', { name: 'Decision' })).toHaveCount(0);
});

test('two decisions on one version: the later one is refused with a clear message', async ({ page, context }) => {
  test.setTimeout(120_000);
  const name = `Race ${Date.now()}`;
  await signInWithPassword(page, DEMO.experimenter);
  await page.goto('/protocols/new');
  const form = page.getByRole('form', { name: 'New protocol' });
  await form.getByLabel('Name').fill(name);
  await form.getByLabel(/Bench 2 — blue light/).check();
  await page.getByRole('button', { name: 'Create protocol' }).click();
  await expect(page).toHaveURL(/\/versions\/1$/);
  const submit = page.getByRole('form', { name: 'Submit for review' });
  await submit.getByLabel('Justification for the warnings').fill('Needed for the test.');
  await submit.getByRole('button', { name: 'Submit for review' }).click();
  await expect(badge(page)).toHaveText('In review');
  await signOut(page);

  // The officer has the review open twice (two tabs, or two officers): both show "in review".
  await signInWithPassword(page, DEMO.officer);
  await page.goto('/reviews');
  await page.getByTestId('review-queue').getByRole('row').filter({ hasText: name }).getByRole('link', { name }).click();
  await expect(page.getByRole('form', { name: 'Decision' })).toBeVisible();
  const other = await context.newPage();
  await other.goto(page.url());
  await other.getByRole('form', { name: 'Decision' }).getByRole('button', { name: 'Approve this version' }).click();
  await expect(badge(other)).toHaveText('Approved');

  const stale = page.getByRole('form', { name: 'Decision' });
  await stale.getByLabel('Return with comments').check();
  await stale.getByLabel('What needs to change').fill('Too late.');
  await stale.getByRole('button', { name: 'Return to the author' }).click();
  await expect(stale.getByRole('alert')).toHaveText('Someone else acted on this version first; reload to see its state.');
  await page.reload();
  await expect(badge(page)).toHaveText('Approved');
});
