// The payment webhooks: signed, applied once, and the read-only rule they drive. Every event
// here is a real one sent by the local payment fake, which scripts/test.sh starts.
import { afterAll, describe, expect, it } from 'vitest';
import Stripe from 'stripe';
import { APP_URL, Client, newOrganisation } from './helpers/http';
import { closeDb, count, rows } from './helpers/db';

const FAKE = `http://127.0.0.1:${process.env.STRIPE_FAKE_PORT ?? 12111}`;
const SECRET = process.env.STRIPE_WEBHOOK_SECRET ?? '';
const signer = new Stripe(process.env.STRIPE_SECRET_KEY ?? 'sk_test_fake_local');

type FakeEvent = { id: string; type: string; data: { object: Record<string, unknown> } };

async function fake(path: string, body?: unknown) {
  const res = await fetch(FAKE + path, {
    method: body === undefined ? 'GET' : 'POST',
    headers: { 'content-type': 'application/json' },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  if (!res.ok) throw new Error(`fake ${path}: ${res.status} ${await res.text()}`);
  return res.json();
}

/** Buys seats through checkout and the fake's card page, as a billing member would. */
async function subscribe(client: Client, organizationId: number, seats: number) {
  const started = await client.post('/api/billing/checkout', { seats });
  expect(started.status).toBe(201);
  const paid = await fetch(`${started.json.checkout.url}/pay`, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: 'card=4242+4242+4242+4242&expiry=12%2F34&cvc=123',
    redirect: 'manual',
  });
  expect(paid.status).toBe(303);
  const [row] = await subscriptionRow(organizationId);
  expect(row.status).toBe('active');
  return row.stripeSubscriptionId as string;
}

const subscriptionRow = (organizationId: number) =>
  rows<{
    status: string;
    seats: number;
    stripeSubscriptionId: string;
    cancelAtPeriodEnd: number;
    endedAt: Date;
  }>(
    'SELECT status, seats, stripeSubscriptionId, cancelAtPeriodEnd, endedAt FROM Subscriptions WHERE organizationId = ?',
    [organizationId],
  );

async function eventsOf(subscription: string, type: string): Promise<FakeEvent[]> {
  const list = await fake(`/_control/events?subscription=${subscription}&type=${type}`);
  return list.data;
}

function postWebhook(payload: string, signature?: string) {
  return fetch(`${APP_URL}/api/webhooks/payments`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', ...(signature ? { 'stripe-signature': signature } : {}) },
    body: payload,
  });
}

const project = (code: string) => ({
  name: 'Read-only check',
  code,
  currency: 'EUR',
  estimateClass: 4,
  stage: 'Concept',
  baseDate: '2027-01-04',
});

afterAll(closeDb);

describe('payment webhooks', () => {
  it('applies a redelivered event once: replaying an old event changes nothing', async () => {
    const org = await newOrganisation('replay');
    const subscription = await subscribe(org.client, org.organizationId, 3);
    const [created] = await eventsOf(subscription, 'customer.subscription.created');
    const [firstInvoice] = await eventsOf(subscription, 'invoice.paid');

    // Move on from the state the first event describes: 3 → 4 seats.
    const preview = await org.client.post('/api/billing/seats/preview', { seats: 4 });
    expect(preview.status).toBe(200);
    const changed = await org.client.post('/api/billing/seats', {
      seats: 4,
      prorationDate: preview.json.preview.prorationDate,
    });
    expect(changed.status).toBe(200);
    expect((await subscriptionRow(org.organizationId))[0].seats).toBe(4);
    const invoicesBefore = await count('Invoices', 'organizationId = ?', [org.organizationId]);

    // The same events again, freshly signed: accepted as duplicates and not applied.
    for (const event of [created, firstInvoice]) {
      const payload = JSON.stringify(event);
      const res = await postWebhook(
        payload,
        signer.webhooks.generateTestHeaderString({ payload, secret: SECRET }),
      );
      expect(res.status).toBe(200);
      expect((await res.json()).duplicate).toBe(true);
    }
    // And once more through the fake's own redelivery.
    await fake('/_control/redeliver', { event: created.id });

    expect((await subscriptionRow(org.organizationId))[0].seats).toBe(4);
    expect(await count('Invoices', 'organizationId = ?', [org.organizationId])).toBe(invoicesBefore);
    expect(await count('WebhookEvents', 'eventId = ?', [created.id])).toBe(1);
  });

  it('answers 400 to a tampered payload, a wrong secret and a missing signature, and changes nothing', async () => {
    const org = await newOrganisation('tamper');
    const subscription = await subscribe(org.client, org.organizationId, 2);
    const [created] = await eventsOf(subscription, 'customer.subscription.created');
    // A new event id, so that only the signature check can stop it.
    const forged = structuredClone(created) as FakeEvent & {
      data: { object: { items: { data: { quantity: number }[] } } };
    };
    forged.id = `${created.id}_forged`;
    const genuine = JSON.stringify(forged);
    const signature = signer.webhooks.generateTestHeaderString({ payload: genuine, secret: SECRET });
    forged.data.object.items.data[0].quantity = 50;
    const tampered = JSON.stringify(forged);

    const responses = [
      await postWebhook(tampered, signature),
      await postWebhook(
        tampered,
        signer.webhooks.generateTestHeaderString({ payload: tampered, secret: 'whsec_wrong' }),
      ),
      await postWebhook(tampered),
      await postWebhook(tampered, 't=1,v1=deadbeef'),
    ];
    expect(responses.map((r) => r.status)).toEqual([400, 400, 400, 400]);
    expect((await subscriptionRow(org.organizationId))[0].seats).toBe(2);
    expect(await count('WebhookEvents', 'eventId = ?', [forged.id])).toBe(0);
  });

  it('keeps a cancelled subscription cancelled when an older event arrives late', async () => {
    const org = await newOrganisation('late');
    const subscription = await subscribe(org.client, org.organizationId, 2);
    const [created] = await eventsOf(subscription, 'customer.subscription.created');
    expect((created.data.object as { status: string }).status).toBe('active');

    expect((await org.client.post('/api/billing/cancel', {})).status).toBe(200);
    await fake('/_control/renew', { subscription });
    expect((await subscriptionRow(org.organizationId))[0].status).toBe('canceled');

    // The creation event once more, as a retry of a delivery that failed at the time: an id the
    // app has not seen, validly signed, describing the subscription as it was before the end.
    const late = { ...created, id: `${created.id}_retry` };
    const payload = JSON.stringify(late);
    const res = await postWebhook(
      payload,
      signer.webhooks.generateTestHeaderString({ payload, secret: SECRET }),
    );
    expect(res.status).toBe(200);
    expect((await res.json()).duplicate).toBe(false);

    const [row] = await subscriptionRow(org.organizationId);
    expect(row.status).toBe('canceled');
    expect(row.endedAt).not.toBeNull();
    const refused = await org.client.post('/api/projects', project('LT-1'));
    expect(refused.status).toBe(402);
    expect((await org.client.get('/api/billing')).json.billing.access).toEqual({
      readOnly: true,
      reason: 'ended',
    });
  });
});

describe('read-only when unpaid', () => {
  it('refuses edits while past due, keeps reads, and allows edits again once paid', async () => {
    const org = await newOrganisation('pastdue');
    const subscription = await subscribe(org.client, org.organizationId, 2);
    expect((await org.client.post('/api/projects', project('PD-1'))).status).toBe(201);

    await fake('/_control/renew', { subscription, fail: true });
    expect((await subscriptionRow(org.organizationId))[0].status).toBe('past_due');
    const refused = await org.client.post('/api/projects', project('PD-2'));
    expect(refused.status).toBe(402);
    expect(refused.json.error.code).toBe('read_only');
    expect(refused.json.error.message).toMatch(/read-only until the subscription is paid/);
    expect(refused.json.error.message).toMatch(/data is kept/i);
    expect(await count('Projects', 'organizationId = ? AND code = ?', [org.organizationId, 'PD-2'])).toBe(0);
    // Reads still work. (Exports arrive with the registers; this checks the read route.)
    const read = await org.client.get('/api/projects');
    expect(read.status).toBe(200);
    expect(read.json.projects.map((p: { code: string }) => p.code)).toEqual(['PD-1']);
    // The failed renewal is in the invoice list as unpaid.
    const billing = await org.client.get('/api/billing');
    expect(billing.json.billing.access).toEqual({ readOnly: true, reason: 'past_due' });
    expect(billing.json.billing.invoices[0].status).toBe('open');

    await fake('/_control/pay-open-invoice', { subscription });
    expect((await subscriptionRow(org.organizationId))[0].status).toBe('active');
    expect((await org.client.post('/api/projects', project('PD-2'))).status).toBe(201);
  });

  it('keeps working until the period ends after a cancellation, then becomes read-only', async () => {
    const org = await newOrganisation('ended');
    const subscription = await subscribe(org.client, org.organizationId, 2);

    expect((await org.client.post('/api/billing/cancel', {})).status).toBe(200);
    expect((await subscriptionRow(org.organizationId))[0].cancelAtPeriodEnd).toBeTruthy();
    expect((await org.client.post('/api/projects', project('EN-1'))).status).toBe(201);

    // Resume, then cancel again: the flag follows.
    expect((await org.client.post('/api/billing/resume', {})).status).toBe(200);
    expect((await subscriptionRow(org.organizationId))[0].cancelAtPeriodEnd).toBeFalsy();
    expect((await org.client.post('/api/billing/cancel', {})).status).toBe(200);

    await fake('/_control/renew', { subscription });
    const [row] = await subscriptionRow(org.organizationId);
    expect(row.status).toBe('canceled');
    expect(row.endedAt).not.toBeNull();
    const refused = await org.client.post('/api/projects', project('EN-2'));
    expect(refused.status).toBe(402);
    expect(refused.json.error.message).toMatch(/read-only/);
    const read = await org.client.get('/api/projects');
    expect(read.status).toBe(200);
    expect(read.json.projects.map((p: { code: string }) => p.code)).toEqual(['EN-1']);
    // A cancelled subscription cannot change seats; buying again goes through checkout.
    expect((await org.client.post('/api/billing/seats/preview', { seats: 3 })).status).toBe(400);
    await subscribe(org.client, org.organizationId, 2);
    expect((await org.client.post('/api/projects', project('EN-2'))).status).toBe(201);
  });
});
