import { expect, type Page } from '@playwright/test';

export const DEMO_PASSWORD = 'pulseloom-demo';
export const DEMO = {
  experimenter: 'ada.quill@harborlane.test',
  officer: 'tomas.reyes@harborlane.test',
  admin: 'noor.hale@harborlane.test',
  otherLab: 'ines.okafor@ridgeway.test',
} as const;

export async function signInWithPassword(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.goto('/signin');
  await page.getByLabel('E-mail').first().fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await expect(page.getByTestId('user-roles')).toBeVisible();
}

export async function signOut(page: Page) {
  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page).toHaveURL(/\/signin/);
}
