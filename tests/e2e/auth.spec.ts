import { expect, test } from './fixtures';
import { AuthPages } from './pages/auth';

// A wrong password is refused on purpose: the browser logs the 401 of the sign-in request.
test.use({ allowedConsoleErrors: [/status of 401 .*\/api\/auth\/callback\/credentials\)$/] });

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

test('sign-in never follows a callback to another site', async ({ page, baseURL }) => {
  const email = `e2e-callback-${Date.now()}@test.example`;
  const password = 'a sensible passphrase';
  const auth = new AuthPages(page);
  await auth.signUp({ name: 'Cal Back', organization: 'Callback Works', email, password });
  await expect(page).toHaveURL(/\/projects$/);
  await auth.signOut();
  for (const target of ['//evil.example/x', '/\\evil.example/x']) {
    await page.goto(`/sign-in?callbackUrl=${encodeURIComponent(target)}`);
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill(password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect(page).toHaveURL(`${baseURL}/projects`);
    await auth.signOut();
  }
});

test('pages run their scripts under the content security policy', async ({ page }) => {
  const violations: string[] = [];
  page.on('console', (message) => {
    if (/Content Security Policy/i.test(message.text())) violations.push(message.text());
  });
  const response = await page.goto('/sign-in');
  expect(response?.headers()['content-security-policy']).toMatch(/script-src 'self' 'nonce-/);
  // Hydrated: the client-side check answers without a page load.
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByText('Enter a valid e-mail address')).toBeVisible();
  await page.goto('/');
  expect(violations).toEqual([]);
});
