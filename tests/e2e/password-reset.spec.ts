import { expect, test } from './fixtures';
import { AuthPages } from './pages/auth';
import { linkIn, waitForMail } from '../../scripts/fakes/mail/client';

test('a member who forgot the password asks for a link, sets a new password and signs in', async ({
  page,
  baseURL,
}) => {
  const auth = new AuthPages(page);
  const email = `forgetful-${Date.now()}@test.example`;
  await auth.signUp({
    name: 'Forgetful Person',
    organization: 'Forgetful Ltd',
    email,
    password: 'the first password',
  });
  await expect(page).toHaveURL(/\/projects/);
  await auth.signOut();

  await page.getByRole('link', { name: 'Forgot your password?' }).click();
  await expect(page).toHaveURL(/\/forgot-password$/);
  await page.getByLabel('E-mail').fill(email);
  await page.getByRole('button', { name: 'Send me a reset link' }).click();
  await expect(page.getByText('a link to set a new password is on its way')).toBeVisible();

  const [mail] = await waitForMail(email, { kind: 'password_reset' });
  const link = linkIn(mail, `${baseURL}/reset-password/`);
  await page.goto(link);
  await expect(page.getByRole('heading', { name: 'Set a new password' })).toBeVisible();

  // The form checks the rule and the repeat before anything is sent.
  await page.getByLabel('New password', { exact: true }).fill('too short');
  await page.getByLabel('New password again').fill('too shorts');
  await page.getByRole('button', { name: 'Set the new password' }).click();
  await expect(page.getByText('Use at least 10 characters for the password.')).toBeVisible();
  await expect(page.getByText('The two passwords differ.')).toBeVisible();

  await page.getByLabel('New password', { exact: true }).fill('the second password');
  await page.getByLabel('New password again').fill('the second password');
  await page.getByRole('button', { name: 'Set the new password' }).click();
  await expect(page.getByText('Password changed')).toBeVisible();
  await page.getByRole('link', { name: 'Sign in' }).click();

  await auth.signIn(email, 'the second password');
  await expect(page).toHaveURL(/\/projects$/);
  await expect(auth.signedInAs()).toContainText('Forgetful Person');

  // The link is spent.
  await page.goto(link);
  await expect(page.getByRole('heading', { name: 'This link was already used' })).toBeVisible();
});
