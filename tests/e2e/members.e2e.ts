import { expect, test } from '@playwright/test';
import { DEMO, signInWithPassword, signOut } from './support/auth';

test('a lab admin invites someone; the e-mailed link signs them in and joins the lab', async ({ page }) => {
  const invitee = `lee.park.${Date.now()}@example.test`;
  await signInWithPassword(page, DEMO.admin);
  await page.goto('/members');
  const form = page.getByRole('form', { name: 'Invite someone' });
  await form.getByLabel('E-mail').fill(invitee);
  await form.getByLabel('Experimenter').uncheck();
  await form.getByLabel('Safety officer').check();
  await page.getByRole('button', { name: 'Send invitation' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Invitation sent' })).toBeVisible();
  await signOut(page);

  // Delivery runs after the commit; the mailbox shows it within a moment.
  await expect(async () => {
    await page.goto('/dev/mailbox');
    await expect(page.getByTestId('mail').filter({ hasText: invitee }).first()).toBeVisible({ timeout: 1000 });
  }).toPass({ timeout: 20_000 });
  const mail = page.getByTestId('mail').filter({ hasText: invitee }).first();
  const link = await mail.getByRole('link').first().getAttribute('href');
  expect(link).toMatch(/\/invite\/inv_/);

  await page.goto(link!);
  await page.getByLabel(/Your name/).fill('Lee Park');
  await page.getByRole('button', { name: 'Join the lab' }).click();
  await expect(page.getByTestId('user-roles')).toContainText('Lee Park');
  await expect(page.getByTestId('user-roles')).toContainText('Safety officer');
  await expect(page.getByRole('navigation', { name: 'Lab sections' }).getByRole('link', { name: 'Reviews' })).toBeVisible();

  // The link works once.
  await signOut(page);
  await page.goto(link!);
  await expect(page.getByRole('heading', { name: 'This invitation cannot be used' })).toBeVisible();
});

test('the invite form names the field and the reason for bad input', async ({ page }) => {
  await signInWithPassword(page, DEMO.admin);
  await page.goto('/members');
  const form = page.getByRole('form', { name: 'Invite someone' });
  await form.getByLabel('E-mail').fill('not an address');
  await form.getByLabel('Experimenter').uncheck();
  await page.getByRole('button', { name: 'Send invitation' }).click();
  await expect(page.locator('#invite-email-err')).toHaveText('Enter an e-mail address');
  await expect(page.getByText('Pick at least one role')).toBeVisible();
});
