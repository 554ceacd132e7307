import { expect, test } from './fixtures';
import type { APIRequestContext, Page } from '@playwright/test';
import { AuthPages, DEMO_PASSWORD, demoEmail } from './pages/auth';

// An invitation past the paid seats is refused on purpose: the browser logs the refusal.
test.use({ allowedConsoleErrors: [/status of 4\d\d .*\/api\/invitations\)$/] });

const PASSWORD = 'a sensible passphrase';

/** Invites someone with the owner's session and accepts as the invitee; returns the e-mail. */
async function addMember(owner: Page, request: APIRequestContext, role: string, label: string) {
  const email = `${label}-${Date.now()}-${Math.floor(Math.random() * 1e6)}@test.example`;
  const invited = await owner.request.post('/api/invitations', { data: { email, role } });
  expect(invited.status()).toBe(201);
  await acceptLink(request, (await invited.json()).invitation.link, label);
  return email;
}

async function acceptLink(request: APIRequestContext, link: string, label: string) {
  const token = String(link).split('/').pop();
  const accepted = await request.post(`/api/invitations/accept/${token}`, {
    data: { name: `${label} person`, password: PASSWORD },
  });
  expect(accepted.status()).toBe(200);
}

async function signInTo(page: Page, email: string, password: string, path: string) {
  const auth = new AuthPages(page);
  await auth.signIn(email, password);
  await expect(page).not.toHaveURL(/\/sign-in/);
  await page.goto(path);
}

test('a billing member buys 5 seats with the test card, a declined card changes nothing, and the owner can then invite a fourth estimator', async ({
  page,
  browser,
  request,
}) => {
  test.setTimeout(120_000);
  // A fresh organisation on its trial: owner + 2 estimators fill the 3 trial seats.
  const auth = new AuthPages(page);
  const ownerEmail = `seat-owner-${Date.now()}@test.example`;
  await auth.signUp({
    name: 'Aino Varga',
    organization: 'Varga Civil Partners',
    email: ownerEmail,
    password: PASSWORD,
  });
  await expect(page).toHaveURL(/\/projects$/);
  await addMember(page, request, 'estimator', 'est1');
  await addMember(page, request, 'estimator', 'est2');
  const billingEmail = await addMember(page, request, 'billing', 'payer');

  // One more estimator is refused, with a link to billing.
  await page.getByRole('link', { name: 'Members' }).click();
  await page.getByLabel('E-mail').fill(`est3-${Date.now()}@test.example`);
  await page.getByLabel('Role', { exact: true }).selectOption('estimator');
  await page.getByRole('button', { name: 'Invite' }).click();
  await expect(
    page.getByRole('alert').filter({ hasText: 'Buy more seats in Billing and seats' }),
  ).toContainText('All 3 paid seats are taken');
  await expect(page.getByTestId('seats-billing-link')).toHaveAttribute('href', '/settings/billing');

  // The billing member, in a browser of their own.
  const payerContext = await browser.newContext();
  const payer = await payerContext.newPage();
  await signInTo(payer, billingEmail, PASSWORD, '/settings/billing');
  await expect(payer.getByTestId('billing-status')).toHaveText('Trial');
  await expect(payer.getByTestId('seats-used')).toHaveText('3');
  await expect(payer.getByTestId('seats-bought')).toHaveText('3');

  // A declined card: the payment page says so, and going back shows the seats unchanged.
  await payer.getByLabel('Paid seats').fill('5');
  await payer.getByRole('button', { name: 'Continue to payment' }).click();
  await expect(payer).toHaveURL(/\/checkout\/cs_test_/);
  await expect(payer.getByTestId('checkout-total')).toContainText('€245.00');
  await payer.getByLabel('Card number').fill('4000 0000 0000 0002');
  await payer.getByLabel('Expiry (MM / YY)').fill('12 / 34');
  await payer.getByLabel('CVC').fill('123');
  await payer.getByRole('button', { name: /^Pay/ }).click();
  await expect(payer.getByRole('alert')).toHaveText('Your card was declined. No payment was taken.');
  await payer.getByRole('link', { name: 'Cancel and go back' }).click();
  await expect(payer.getByText('Checkout cancelled: nothing was charged')).toBeVisible();
  await expect(payer.getByTestId('billing-status')).toHaveText('Trial');
  await expect(payer.getByTestId('seats-bought')).toHaveText('3');

  // The test card pays: back in the app the organisation has 5 active seats and an invoice.
  await payer.getByLabel('Paid seats').fill('5');
  await payer.getByRole('button', { name: 'Continue to payment' }).click();
  await payer.getByLabel('Card number').fill('4242 4242 4242 4242');
  await payer.getByLabel('Expiry (MM / YY)').fill('12 / 34');
  await payer.getByLabel('CVC').fill('123');
  await payer.getByRole('button', { name: /^Pay/ }).click();
  await expect(payer).toHaveURL(/\/settings\/billing\?checkout=success/);
  await expect(payer.getByText('Payment received.')).toBeVisible();
  await expect(payer.getByTestId('billing-status')).toHaveText('Active');
  await expect(payer.getByTestId('seats-bought')).toHaveText('5');
  await expect(payer.getByRole('table', { name: 'Invoices' })).toContainText('€245.00');
  await payer.screenshot({ path: 'test-results/billing-after-checkout.png', fullPage: true });
  await payerContext.close();

  // The owner now invites a third estimator (accepted) and a fourth, filling the 5 seats.
  await page.reload();
  await page.getByLabel('E-mail').fill(`est3-${Date.now()}@test.example`);
  await page.getByLabel('Role', { exact: true }).selectOption('estimator');
  await page.getByRole('button', { name: 'Invite' }).click();
  await expect(page.getByTestId('invitation-link')).toContainText('/invitations/');
  await acceptLink(request, (await page.getByTestId('invitation-link').textContent()) ?? '', 'est3');

  const fourth = `est4-${Date.now()}@test.example`;
  await page.getByLabel('E-mail').fill(fourth);
  await page.getByLabel('Role', { exact: true }).selectOption('estimator');
  await page.getByRole('button', { name: 'Invite' }).click();
  await expect(page.getByText(fourth)).toBeVisible();
  await expect(page.getByText('paid seats are taken')).toHaveCount(0);
  await acceptLink(request, (await page.getByTestId('invitation-link').textContent()) ?? '', 'est4');
  await page.getByRole('link', { name: 'Billing and seats' }).click();
  await expect(page.getByTestId('seats-used')).toHaveText('5');
  await expect(page.getByTestId('seats-bought')).toHaveText('5');
});

test('the demo billing member sees the plan, its invoice and the prorated price of more seats before confirming', async ({
  page,
}) => {
  await signInTo(page, demoEmail('billing'), DEMO_PASSWORD, '/settings/billing');
  await expect(page.getByTestId('billing-status')).toHaveText('Active');
  await expect(page.getByTestId('seats-bought')).toHaveText('5');
  await expect(page.getByRole('table', { name: 'Invoices' })).toContainText('FAKE-00001');
  await page.getByLabel('Paid seats').fill('6');
  await page.getByRole('button', { name: 'Preview the change' }).click();
  const preview = page.getByTestId('seat-preview');
  await expect(preview).toContainText('From 5 to 6 seats');
  // One more seat for the remaining ~20 of 30 days: about two thirds of €49.
  const amount = Number((await page.getByTestId('proration-amount').textContent())!.replace(/[^0-9.]/g, ''));
  expect(amount).toBeGreaterThan(30);
  expect(amount).toBeLessThan(35);
  await page.screenshot({ path: 'test-results/billing-preview.png', fullPage: true });
  // Keeping the seats changes nothing (the demo stays at 5 for other tests).
  await page.getByRole('button', { name: 'Keep 5' }).click();
  await expect(preview).toHaveCount(0);
  await expect(page.getByTestId('seats-bought')).toHaveText('5');
});

test('estimators and sponsors are kept out of billing', async ({ page }) => {
  await signInTo(page, demoEmail('estimator'), DEMO_PASSWORD, '/projects');
  await expect(page.getByRole('link', { name: 'Billing and seats' })).toHaveCount(0);
  await page.goto('/settings/billing');
  await expect(page).toHaveURL(/\/forbidden$/);
});

test('a past-due organisation sees the read-only banner until it pays', async ({ page, request }) => {
  const fake = `http://127.0.0.1:${process.env.STRIPE_FAKE_PORT ?? 12111}`;
  const auth = new AuthPages(page);
  await auth.signUp({
    name: 'Lotte Brandt',
    organization: 'Brandt Water Consult',
    email: `pastdue-${Date.now()}@test.example`,
    password: PASSWORD,
  });
  await expect(page).toHaveURL(/\/projects$/);
  await expect(page.getByTestId('read-only-banner')).toHaveCount(0);
  const started = await page.request.post('/api/billing/checkout', { data: { seats: 2 } });
  const { url } = (await started.json()).checkout;
  await request.post(`${url}/pay`, { form: { card: '4242424242424242' }, maxRedirects: 0 });
  const billing = (await (await page.request.get('/api/billing')).json()).billing;
  expect(billing.status).toBe('active');
  // The fake's completed-checkout event names the subscription it created.
  const sessionId = String(url).split('/').pop();
  const completed = await request.get(`${fake}/_control/events?type=checkout.session.completed`);
  const events = (await completed.json()).data as {
    data: { object: { id: string; subscription: string } };
  }[];
  const subscription = events.find((e) => e.data.object.id === sessionId)!.data.object.subscription;

  await request.post(`${fake}/_control/renew`, { data: { subscription, fail: true } });
  await page.reload();
  await expect(page.getByTestId('read-only-banner')).toContainText(
    'read-only until the subscription is paid',
  );
  await page.getByRole('link', { name: 'Go to billing and seats' }).click();
  await expect(page.getByTestId('billing-status')).toHaveText('Past due');
  await expect(page.getByRole('table', { name: 'Invoices' })).toContainText('Unpaid');
  await page.screenshot({ path: 'test-results/billing-past-due.png', fullPage: true });

  await request.post(`${fake}/_control/pay-open-invoice`, { data: { subscription } });
  await page.reload();
  await expect(page.getByTestId('billing-status')).toHaveText('Active');
  await expect(page.getByTestId('read-only-banner')).toHaveCount(0);
});
