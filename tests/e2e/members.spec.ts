import { expect, test } from '@playwright/test';
import { AuthPages, DEMO_PASSWORD, demoEmail } from './pages/auth';

test('the demo owner invites a sponsor and sees the link', async ({ page }) => {
  const auth = new AuthPages(page);
  await auth.signIn(demoEmail('owner'), DEMO_PASSWORD);
  await expect(page).toHaveURL(/\/projects$/);
  await page.getByRole('link', { name: 'Members' }).click();
  await expect(page.getByTestId(`member-${demoEmail('estimator')}`)).toBeVisible();
  const email = `sponsor-${Date.now()}@test.example`;
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Role', { exact: true }).selectOption('sponsor');
  await page.getByRole('button', { name: 'Invite' }).click();
  await expect(page.getByTestId('invitation-link')).toContainText('/invitations/');
  await expect(page.getByText(email)).toBeVisible();
});

test('an estimator is kept out of the members page', async ({ page }) => {
  const auth = new AuthPages(page);
  await auth.signIn(demoEmail('estimator'), DEMO_PASSWORD);
  await expect(page).toHaveURL(/\/projects$/);
  await expect(page.getByRole('link', { name: 'Members' })).toHaveCount(0);
  await page.goto('/settings/members');
  await expect(page).toHaveURL(/\/forbidden$/);
});
