import { expect, test } from '@playwright/test';
import { AuthPages } from './pages/auth';

test('sign up, sign out and sign in again', async ({ page }) => {
  const auth = new AuthPages(page);
  const email = `e2e-${Date.now()}@test.example`;
  const password = 'a sensible passphrase';

  await auth.signUp({ name: 'Maren Holt', organization: 'Holt Rail Advisory', email, password });
  await expect(page).toHaveURL(/\/projects$/);
  await expect(auth.signedInAs()).toContainText('Maren Holt');
  await expect(page.getByText('No projects yet')).toBeVisible();

  await auth.signOut();
  await auth.signIn(email, 'not the password');
  await expect(page.getByText('That e-mail and password do not match an account.')).toBeVisible();

  await auth.signIn(email, password);
  await expect(page).toHaveURL(/\/projects$/);
  await expect(auth.signedInAs()).toContainText('Owner');
});

test('sign-up shows what is wrong with each field', async ({ page }) => {
  const auth = new AuthPages(page);
  await auth.signUp({ name: 'X', organization: 'Y', email: 'nope', password: 'short' });
  await expect(page.getByText('Enter a valid e-mail address')).toBeVisible();
  await expect(page.getByText('Use at least 10 characters')).toBeVisible();
  await expect(page).toHaveURL(/\/sign-up$/);
});

test('a signed-out visit to a workspace page goes to sign-in, then back', async ({ page }) => {
  await page.goto('/projects/1');
  await expect(page).toHaveURL(/\/sign-in\?callbackUrl=/);
  await expect(page.getByRole('heading', { name: 'Sign in' })).toBeVisible();
});

test('the landing page says what the product does', async ({ page }) => {
  await page.goto('/');
  await expect(page.getByRole('heading', { level: 1 })).toContainText('finally cost');
  await expect(page.getByRole('link', { name: 'Sign in' }).first()).toBeVisible();
});
