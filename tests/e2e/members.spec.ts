import { expect, test } from './fixtures';
import type { Page } from '@playwright/test';
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

/** The demo owner invites an address and returns the invitation's path on this site. */
async function inviteAsDemoOwner(page: Page, email: string, role: string): Promise<string> {
  const auth = new AuthPages(page);
  await auth.signIn(demoEmail('owner'), DEMO_PASSWORD);
  await expect(page).toHaveURL(/\/projects$/);
  await page.goto('/settings/members');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Role', { exact: true }).selectOption(role);
  await page.getByRole('button', { name: 'Invite' }).click();
  const link = page.getByTestId('invitation-link');
  await expect(link).toContainText('/invitations/');
  return new URL((await link.textContent())!.trim()).pathname;
}

test('a new person accepts an invitation by making an account', async ({ page, browser }) => {
  const email = `newcomer-${Date.now()}@test.example`;
  const path = await inviteAsDemoOwner(page, email, 'sponsor');
  const invitee = await (await browser.newContext()).newPage();
  await invitee.goto(path);
  await expect(invitee.getByRole('heading', { name: /Join/ })).toBeVisible();
  await invitee.getByLabel('Your name').fill('Nia Newcomer');
  await invitee.getByLabel('Choose a password').fill('a fresh long password');
  await invitee.getByRole('button', { name: 'Create account and join' }).click();
  await expect(invitee).toHaveURL(/\/projects$/);
  await expect(new AuthPages(invitee).signedInAs()).toContainText('Nia Newcomer');
});

test('someone with an account signs in to accept, and comes back to the invitation', async ({
  page,
  browser,
}) => {
  const email = `member-elsewhere-${Date.now()}@test.example`;
  const password = 'an existing long password';
  const invitee = await (await browser.newContext()).newPage();
  const inviteeAuth = new AuthPages(invitee);
  await inviteeAuth.signUp({ name: 'Ola Elsewhere', organization: 'Elsewhere Ltd', email, password });
  await expect(invitee).toHaveURL(/\/projects$/);
  await inviteeAuth.signOut();

  const path = await inviteAsDemoOwner(page, email, 'sponsor');
  await invitee.goto(path);
  // The page never asks for the current password of an account.
  await expect(invitee.getByText(/current password/i)).toHaveCount(0);
  await invitee.getByRole('link', { name: 'Sign in to accept' }).click();
  await expect(invitee).toHaveURL(/\/sign-in\?callbackUrl=/);
  await invitee.getByLabel('E-mail').fill(email);
  await invitee.getByLabel('Password').fill(password);
  await invitee.getByRole('button', { name: 'Sign in' }).click();
  await expect(invitee).toHaveURL(new RegExp(`${path}$`));
  await expect(invitee.getByText(`You are signed in as ${email}.`)).toBeVisible();
  await invitee.getByRole('button', { name: 'Accept and join' }).click();
  await expect(invitee).toHaveURL(/\/projects$/);

  // The demo owner now sees the new member.
  await page.goto('/settings/members');
  await expect(page.getByTestId(`member-${email}`)).toBeVisible();
});
