import { expect, test } from '@playwright/test';
import { DEMO, signInWithPassword, signOut } from './support/auth';

const navOf = (page: import('@playwright/test').Page) => page.getByRole('navigation', { name: 'Lab sections' }).getByRole('link');

test('each demo role signs in with a password and sees its own navigation', async ({ page }) => {
  const expected: Record<string, string[]> = {
    [DEMO.experimenter]: ['Overview', 'Envelopes', 'Protocols', 'Rigs'],
    [DEMO.officer]: ['Overview', 'Envelopes', 'Protocols', 'Reviews', 'Rigs', 'Limits', 'Audit'],
    [DEMO.admin]: ['Overview', 'Envelopes', 'Protocols', 'Rigs', 'Limits', 'Audit', 'Members'],
  };
  for (const [email, items] of Object.entries(expected)) {
    await signInWithPassword(page, email);
    await expect(page.getByTestId('lab-name').or(page.getByLabel('Current lab'))).toBeVisible();
    await expect(navOf(page)).toHaveText(items);
    await signOut(page);
  }
});

test('a wrong password gets one plain message that names no field', async ({ page }) => {
  await page.goto('/signin');
  await page.getByLabel('E-mail').first().fill(DEMO.officer);
  await page.getByLabel('Password').fill('not-the-password');
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await expect(page.getByRole('alert').filter({ hasText: 'do not match' })).toHaveText(
    'That e-mail and password do not match an account.',
  );
});

test('a malformed e-mail is reported on the field, not as an error page', async ({ page }) => {
  await page.goto('/signin');
  await page.getByLabel('E-mail').first().fill('nope');
  await page.getByLabel('Password').fill('x');
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await expect(page.locator('#pw-email-err')).toHaveText('Enter an e-mail address');
});

test('sign in by an e-mail link taken from the development mailbox', async ({ page }) => {
  await page.goto('/signin');
  await page.locator('#link-email').fill(DEMO.experimenter);
  await page.getByRole('button', { name: 'E-mail me a sign-in link' }).click();
  await expect(page.getByRole('heading', { name: 'Check your e-mail' })).toBeVisible();

  await page.goto('/dev/mailbox');
  const mail = page.getByTestId('mail').filter({ hasText: DEMO.experimenter }).filter({ hasText: 'sign-in link' }).first();
  await expect(mail).toBeVisible();
  const link = await mail.getByRole('link').first().getAttribute('href');
  expect(link).toContain('/api/auth/callback/email');
  await page.goto(link!);
  await expect(page.getByTestId('user-roles')).toContainText('Experimenter');
});

test('the wrong role gets a 403 page, and no session gets the sign-in page', async ({ page }) => {
  const anonymous = await page.goto('/members');
  expect(anonymous?.url()).toContain('/signin');

  await signInWithPassword(page, DEMO.experimenter);
  const res = await page.goto('/members');
  expect(res?.status()).toBe(403);
  await expect(page.getByRole('heading', { name: 'Not for your role' })).toBeVisible();
});

test('a member of two labs switches lab from the header', async ({ page }) => {
  await signInWithPassword(page, DEMO.admin);
  const select = page.getByLabel('Current lab');
  await select.selectOption({ label: 'Ridgeway Sensory Lab' });
  await page.getByRole('button', { name: 'Switch' }).click();
  await expect(page.getByRole('heading', { level: 1 })).toHaveText('Ridgeway Sensory Lab');
  await expect(page.getByTestId('user-roles')).toContainText('Experimenter');
});
