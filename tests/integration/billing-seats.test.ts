// Paid seats (owners and estimators) against the organisation's subscription, the trial, the
// prorated seat change, and who may see or change billing.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addMember, Client, demoClient, newOrganisation, uniqueEmail } from './helpers/http';
import { closeDb, count, rows } from './helpers/db';

const DAY = 24 * 3600;

async function buySeats(client: Client, seats: number) {
  const started = await client.post('/api/billing/checkout', { seats });
  expect(started.status).toBe(201);
  const paid = await fetch(`${started.json.checkout.url}/pay`, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: 'card=4242424242424242&expiry=12%2F34&cvc=123',
    redirect: 'manual',
  });
  expect(paid.status).toBe(303);
}

async function invite(owner: Client, role: string) {
  const email = uniqueEmail(role);
  return { email, res: await owner.post('/api/invitations', { email, role }) };
}

async function accept(link: string) {
  const token = link.split('/').pop()!;
  return new Client().post(`/api/invitations/accept/${token}`, {
    name: 'Someone',
    password: 'a long enough password',
  });
}

afterAll(closeDb);

describe('the trial and the seat limit', () => {
  let owner: Client;
  let organizationId: number;

  beforeAll(async () => {
    const org = await newOrganisation('seats');
    owner = org.client;
    organizationId = org.organizationId;
  });

  it('gives a new organisation a 14-day trial with 3 paid seats', async () => {
    const [row] = await rows<{ status: string; seats: number; trialEndsAt: Date }>(
      'SELECT status, seats, trialEndsAt FROM Subscriptions WHERE organizationId = ?',
      [organizationId],
    );
    expect(row.status).toBe('trialing');
    expect(row.seats).toBe(3);
    const days = (new Date(row.trialEndsAt).getTime() / 1000 - Date.now() / 1000) / DAY;
    expect(days).toBeGreaterThan(13.9);
    expect(days).toBeLessThanOrEqual(14);
    const billing = await owner.get('/api/billing');
    expect(billing.status).toBe(200);
    expect(billing.json.billing).toMatchObject({ status: 'trialing', seats: 3, used: 1, subscribed: false });
  });

  it('refuses one more estimator by invitation and by role change, with a link to billing', async () => {
    await addMember(owner, 'estimator', 'est-a');
    await addMember(owner, 'estimator', 'est-b'); // 3 of 3 paid seats now
    const { email, res } = await invite(owner, 'estimator');
    expect(res.status).toBe(400);
    expect(res.json.error.message).toMatch(/All 3 paid seats are taken/);
    expect(res.json.error.message).toContain('/settings/billing');
    expect(res.json.error.details.link).toBe('/settings/billing');
    expect(await count('Invitations', 'email = ?', [email])).toBe(0);

    // Free roles still join; promoting one to a paid role is refused and changes nothing.
    const sponsor = await addMember(owner, 'sponsor', 'free-sponsor');
    const members = (await owner.get('/api/members')).json.members as { id: number; email: string }[];
    const target = members.find((m) => m.email === sponsor.email)!;
    const promoted = await owner.patch(`/api/members/${target.id}`, { role: 'estimator' });
    expect(promoted.status).toBe(400);
    expect(promoted.json.error.details.link).toBe('/settings/billing');
    expect(await count('Memberships', 'id = ? AND role = ?', [target.id, 'sponsor'])).toBe(1);
    expect(
      await count('Memberships', "organizationId = ? AND role IN ('owner','estimator')", [organizationId]),
    ).toBe(3);

    // Moving between paid roles keeps the count, so it is allowed.
    const estimator = members.find((m) => m.email.startsWith('est-a'))!;
    expect((await owner.patch(`/api/members/${estimator.id}`, { role: 'owner' })).status).toBe(200);
  });

  it('checks the seat again when an invitation is accepted', async () => {
    const org = await newOrganisation('accept');
    await addMember(org.client, 'estimator', 'first'); // 2 of 3
    const a = await invite(org.client, 'estimator');
    const b = await invite(org.client, 'estimator');
    expect([a.res.status, b.res.status]).toEqual([201, 201]); // pending invitations hold no seat
    expect((await accept(a.res.json.invitation.link)).status).toBe(200); // 3 of 3
    const late = await accept(b.res.json.invitation.link);
    expect(late.status).toBe(400);
    expect(late.json.error.details.link).toBe('/settings/billing');
    expect(await count('Users', 'email = ?', [b.email])).toBe(0);
  });
});

describe('buying and changing seats', () => {
  it('buys seats, previews the prorated change as the payment service computes it, and charges it', async () => {
    const org = await newOrganisation('prorate');
    await buySeats(org.client, 3);
    const billing = (await org.client.get('/api/billing')).json.billing;
    expect(billing).toMatchObject({ status: 'active', seats: 3, subscribed: true, unitAmount: 4900 });
    expect(billing.invoices).toHaveLength(1);
    expect(billing.invoices[0]).toMatchObject({
      total: 3 * 4900,
      status: 'paid',
      reason: 'subscription_create',
    });

    // Fewer seats than people holding one: refused, naming the field.
    const tooFew = await org.client.post('/api/billing/seats/preview', { seats: 0 });
    expect(tooFew.status).toBe(400);
    expect(tooFew.json.error.issues[0].path).toBe('seats');

    const preview = (await org.client.post('/api/billing/seats/preview', { seats: 5 })).json.preview;
    // Reference: linear proration by the second over the fake's 30-day period,
    // amount = round(unit × new × f) − round(unit × old × f), f = (end − at) / (end − start).
    const end = new Date(preview.periodEnd).getTime() / 1000;
    const f = (end - preview.prorationDate) / (30 * DAY);
    const expected = Math.round(4900 * 5 * f) - Math.round(4900 * 3 * f);
    expect(preview.amountDue).toBe(expected);
    expect(preview.amountDue).toBeGreaterThan(2 * 4900 * 0.99); // a few seconds into a fresh period
    expect(await count('Invoices', 'organizationId = ?', [org.organizationId])).toBe(1); // a preview bills nothing

    const changed = await org.client.post('/api/billing/seats', {
      seats: 5,
      prorationDate: preview.prorationDate,
    });
    expect(changed.status).toBe(200);
    const [row] = await rows<{ seats: number }>('SELECT seats FROM Subscriptions WHERE organizationId = ?', [
      org.organizationId,
    ]);
    expect(row.seats).toBe(5);
    const [update] = await rows<{ total: number; status: string }>(
      "SELECT total, status FROM Invoices WHERE organizationId = ? AND billingReason = 'subscription_update'",
      [org.organizationId],
    );
    expect(update).toEqual({ total: expected, status: 'paid' });

    // A paid subscription changes in place: a second checkout is refused.
    expect((await org.client.post('/api/billing/checkout', { seats: 6 })).status).toBe(400);
  });

  it('refuses a checkout for fewer seats than the paid members', async () => {
    const org = await newOrganisation('fewer');
    await addMember(org.client, 'estimator');
    const res = await org.client.post('/api/billing/checkout', { seats: 1 });
    expect(res.status).toBe(400);
    expect(res.json.error.issues).toEqual([
      { path: 'seats', message: expect.stringMatching(/at least 2 seats/) },
    ]);
  });
});

describe('who may see and change billing', () => {
  let owner: Client;
  let estimator: Client;
  let sponsor: Client;
  let billing: Client;
  let invoiceId: number;

  beforeAll(async () => {
    const org = await newOrganisation('billing-roles');
    owner = org.client;
    estimator = (await addMember(owner, 'estimator')).client;
    sponsor = (await addMember(owner, 'sponsor')).client;
    billing = (await addMember(owner, 'billing')).client;
    await buySeats(billing, 3);
    invoiceId = (await billing.get('/api/billing')).json.billing.invoices[0].id;
  });

  it.each([
    ['estimator', () => estimator],
    ['sponsor', () => sponsor],
  ])('refuses billing to a %s with 403', async (_role, who) => {
    const client = who();
    expect((await client.get('/api/billing')).status).toBe(403);
    expect((await client.get(`/api/billing/invoices/${invoiceId}`)).status).toBe(403);
    expect((await client.post('/api/billing/checkout', { seats: 4 })).status).toBe(403);
    expect((await client.post('/api/billing/seats/preview', { seats: 4 })).status).toBe(403);
    expect((await client.post('/api/billing/seats', { seats: 4 })).status).toBe(403);
    expect((await client.post('/api/billing/cancel', {})).status).toBe(403);
    expect((await client.post('/api/billing/resume', {})).status).toBe(403);
    expect((await client.post('/api/billing/invoices', {})).status).toBe(403);
  });

  it('lets the billing member and the owner read an invoice with its lines', async () => {
    for (const client of [billing, owner]) {
      const res = await client.get(`/api/billing/invoices/${invoiceId}`);
      expect(res.status).toBe(200);
      expect(res.json.invoice.total).toBe(3 * 4900);
      expect(res.json.invoice.lines).toEqual([{ description: '3 × seat (monthly)', amount: 3 * 4900 }]);
    }
  });

  it('reads the invoices again from the payment service only when asked, without duplicating them', async () => {
    const before = (await billing.get('/api/billing')).json.billing.invoices;
    const refreshed = await billing.post('/api/billing/invoices', {});
    expect(refreshed.status).toBe(200);
    expect(refreshed.json.refreshed).toBe(before.length);
    expect((await owner.get('/api/billing')).json.billing.invoices).toEqual(before);
  });

  it('gives 404 for an invoice of another organisation, and 401 when signed out', async () => {
    const demoBilling = await demoClient('billing');
    expect((await demoBilling.get(`/api/billing/invoices/${invoiceId}`)).status).toBe(404);
    expect((await demoBilling.get('/api/billing/invoices/not-a-number')).status).toBe(404);
    expect((await new Client().get('/api/billing')).status).toBe(401);
  });

  it('shows the demo organisation its seeded plan', async () => {
    const demo = (await (await demoClient('billing')).get('/api/billing')).json.billing;
    expect(demo).toMatchObject({ status: 'active', seats: 5, subscribed: true });
    expect(demo.used).toBeGreaterThanOrEqual(2);
  });
});
