import { UniqueConstraintError, type Transaction } from 'sequelize';
import type Stripe from 'stripe';
import { Invoice, Organization, Subscription, WebhookEvent, sequelize } from '@/models';
import type { Actor } from '@/lib/auth/actor';
import { can } from '@/lib/auth/roles';
import { AppError, badRequest, forbidden, notFound } from '@/lib/errors';
import { parseOrThrow } from '@/lib/validation/parse';
import { stripe, webhookSecret } from '@/lib/billing/stripe';
import { PLAN_NAME, SEAT_PRICE_ID, TRIAL_DAYS, TRIAL_SEATS } from '@/lib/billing/plan';
import { changeSeatsSchema, seatsSchema } from '@/lib/billing/schemas';
import { accessOf, type Access } from '@/lib/billing/access';
import { customerIdOf, invoiceFields, organizationIdFrom, subscriptionFields } from '@/lib/billing/mirror';
import { recordAudit } from './audit';
import { seatUsage } from './seats';

// ---- views

export type InvoiceView = {
  id: number;
  number: string | null;
  status: string;
  reason: string | null;
  total: number;
  amountPaid: number;
  currency: string;
  periodStart: string | null;
  periodEnd: string | null;
  issuedAt: string;
  paidAt: string | null;
};

export type BillingOverview = {
  plan: string;
  status: Subscription['status'] | 'none';
  seats: number | null;
  used: number;
  pendingInvitations: number;
  unitAmount: number | null;
  currency: string | null;
  trialEndsAt: string | null;
  currentPeriodEnd: string | null;
  cancelAtPeriodEnd: boolean;
  endedAt: string | null;
  /** A live subscription with the payment service: seats change in place rather than through checkout. */
  subscribed: boolean;
  access: Access;
  invoices: InvoiceView[];
  /** The invoice list could not be refreshed from the payment service; the last copy is shown. */
  invoicesStale: boolean;
};

export type SeatChangePreview = {
  seats: number;
  currentSeats: number;
  prorationDate: number;
  amountDue: number;
  currency: string;
  periodEnd: string | null;
  lines: { description: string; amount: number }[];
};

const iso = (d: Date | null | undefined) => (d ? d.toISOString() : null);

function toInvoiceView(i: Invoice): InvoiceView {
  return {
    id: i.id,
    number: i.number,
    status: i.status,
    reason: i.billingReason,
    total: i.total,
    amountPaid: i.amountPaid,
    currency: i.currency,
    periodStart: iso(i.periodStart),
    periodEnd: iso(i.periodEnd),
    issuedAt: i.issuedAt.toISOString(),
    paidAt: iso(i.paidAt),
  };
}

function assertMay(actor: Actor, action: 'billing:read' | 'billing:manage') {
  if (!can(actor.role, action)) throw forbidden('Only billing members and owners can see or change billing.');
}

/** Errors of the payment service become a clear 502; nothing was changed on our side. */
async function callPayments<T>(what: string, fn: () => Promise<T>): Promise<T> {
  try {
    return await fn();
  } catch (error) {
    const message = (error as { message?: string }).message ?? 'no answer';
    console.error(`payment service: ${what} failed: ${message}`);
    throw new AppError(502, 'payments_unavailable', `The payment service could not ${what}: ${message}`);
  }
}

const isLive = (s: Subscription | null) =>
  Boolean(s?.stripeSubscriptionId) && s!.status !== 'canceled' && s!.status !== 'incomplete_expired';

// ---- trial

/** New organisations try the product with 3 paid seats for 14 days (called inside sign-up's transaction). */
export async function startTrial(organizationId: number, transaction: Transaction): Promise<void> {
  await Subscription.create(
    {
      organizationId,
      status: 'trialing',
      seats: TRIAL_SEATS,
      trialEndsAt: new Date(Date.now() + TRIAL_DAYS * 24 * 3600 * 1000),
    },
    { transaction },
  );
}

// ---- reads

async function refreshInvoices(organizationId: number, customer: string | null): Promise<boolean> {
  if (!customer) return true;
  try {
    const list = await stripe().invoices.list({ customer, limit: 24 });
    for (const invoice of list.data) {
      if (!invoice.id) continue;
      await upsertInvoice(organizationId, invoice);
    }
    return true;
  } catch (error) {
    console.error(`payment service: invoice list failed: ${(error as Error).message}`);
    return false;
  }
}

async function seatPrice(subscription: Subscription | null) {
  if (subscription?.unitAmount != null && subscription.currency)
    return { unitAmount: subscription.unitAmount, currency: subscription.currency };
  try {
    const price = await stripe().prices.retrieve(SEAT_PRICE_ID);
    return { unitAmount: price.unit_amount, currency: price.currency };
  } catch {
    return { unitAmount: null, currency: null };
  }
}

export async function getBillingOverview(actor: Actor): Promise<BillingOverview> {
  assertMay(actor, 'billing:read');
  const organizationId = actor.organizationId;
  const subscription = await Subscription.findOne({ where: { organizationId } });
  const fresh = await refreshInvoices(organizationId, subscription?.stripeCustomerId ?? null);
  const [usage, invoices, price] = await Promise.all([
    seatUsage(organizationId),
    Invoice.findAll({
      where: { organizationId },
      order: [
        ['issuedAt', 'DESC'],
        ['id', 'DESC'],
      ],
      limit: 24,
    }),
    seatPrice(subscription),
  ]);
  return {
    plan: PLAN_NAME,
    status: subscription?.status ?? 'none',
    seats: usage.seats,
    used: usage.used,
    pendingInvitations: usage.pendingInvitations,
    unitAmount: price.unitAmount,
    currency: price.currency,
    trialEndsAt: iso(subscription?.trialEndsAt),
    currentPeriodEnd: iso(subscription?.currentPeriodEnd),
    cancelAtPeriodEnd: Boolean(subscription?.cancelAtPeriodEnd),
    endedAt: iso(subscription?.endedAt),
    subscribed: isLive(subscription),
    access: accessOf(subscription),
    invoices: invoices.map(toInvoiceView),
    invoicesStale: !fresh,
  };
}

export type InvoiceDetail = InvoiceView & { lines: { description: string; amount: number }[] | null };

export async function getInvoice(actor: Actor, invoiceId: number): Promise<InvoiceDetail> {
  assertMay(actor, 'billing:read');
  const invoice = await Invoice.findOne({ where: { id: invoiceId, organizationId: actor.organizationId } });
  if (!invoice) throw notFound('Invoice');
  let lines: InvoiceDetail['lines'] = null;
  try {
    const remote = await stripe().invoices.retrieve(invoice.stripeInvoiceId);
    lines = remote.lines.data.map((l) => ({ description: l.description ?? '', amount: l.amount }));
  } catch {
    lines = null;
  }
  return { ...toInvoiceView(invoice), lines };
}

// ---- changes

async function subscriptionFor(actor: Actor): Promise<Subscription> {
  const existing = await Subscription.findOne({ where: { organizationId: actor.organizationId } });
  if (existing) return existing;
  // An organisation made before billing existed: it starts the usual trial now.
  return Subscription.create({
    organizationId: actor.organizationId,
    status: 'trialing',
    seats: TRIAL_SEATS,
    trialEndsAt: new Date(Date.now() + TRIAL_DAYS * 24 * 3600 * 1000),
  });
}

async function assertCovers(actor: Actor, seats: number) {
  const { used } = await seatUsage(actor.organizationId);
  if (seats < used) {
    const message = `Keep at least ${used} seats: ${used} owners and estimators hold a paid seat now. Change someone's role in Members first.`;
    throw badRequest(message, [{ path: 'seats', message }]);
  }
}

export async function startCheckout(actor: Actor, input: unknown): Promise<{ url: string }> {
  assertMay(actor, 'billing:manage');
  const { seats } = parseOrThrow(seatsSchema, input);
  const subscription = await subscriptionFor(actor);
  if (isLive(subscription))
    throw badRequest('The organisation already has a subscription: change its number of seats instead.');
  await assertCovers(actor, seats);
  const organizationId = String(actor.organizationId);
  let customer = subscription.stripeCustomerId;
  if (!customer) {
    const organization = await Organization.findByPk(actor.organizationId);
    const created = await callPayments('create the customer', () =>
      stripe().customers.create({
        name: organization?.name,
        email: actor.email,
        metadata: { organizationId },
      }),
    );
    customer = created.id;
    await subscription.update({ stripeCustomerId: customer });
  }
  const appUrl = (process.env.APP_URL ?? 'http://localhost:3000').replace(/\/$/, '');
  const session = await callPayments('start the checkout', () =>
    stripe().checkout.sessions.create({
      mode: 'subscription',
      customer: customer!,
      client_reference_id: organizationId,
      line_items: [{ price: SEAT_PRICE_ID, quantity: seats }],
      metadata: { organizationId },
      subscription_data: { metadata: { organizationId } },
      success_url: `${appUrl}/settings/billing?checkout=success&session_id={CHECKOUT_SESSION_ID}`,
      cancel_url: `${appUrl}/settings/billing?checkout=cancelled`,
    }),
  );
  if (!session.url)
    throw new AppError(502, 'payments_unavailable', 'The payment service gave no checkout page.');
  await recordAudit(actor, {
    entity: 'subscription',
    entityId: subscription.id,
    action: 'checkout',
    before: null,
    after: { seats, session: session.id },
  });
  return { url: session.url };
}

async function liveSubscription(actor: Actor) {
  const subscription = await Subscription.findOne({ where: { organizationId: actor.organizationId } });
  if (!subscription || !isLive(subscription))
    throw badRequest('The organisation has no paid subscription yet: buy seats through checkout first.');
  const remote = await callPayments('read the subscription', () =>
    stripe().subscriptions.retrieve(subscription.stripeSubscriptionId!),
  );
  const item = remote.items.data[0];
  if (!item) throw new AppError(502, 'payments_unavailable', 'The subscription has no seat item.');
  return { subscription, remote, item };
}

export async function previewSeatChange(actor: Actor, input: unknown): Promise<SeatChangePreview> {
  assertMay(actor, 'billing:manage');
  const { seats } = parseOrThrow(seatsSchema, input);
  await assertCovers(actor, seats);
  const { remote, item } = await liveSubscription(actor);
  if (seats === item.quantity) {
    const message = `The organisation already has ${seats} seats.`;
    throw badRequest(message, [{ path: 'seats', message }]);
  }
  const prorationDate = Math.floor(Date.now() / 1000);
  const preview = await callPayments('preview the change', () =>
    stripe().invoices.createPreview({
      customer: customerIdOf(remote) ?? undefined,
      subscription: remote.id,
      subscription_details: {
        items: [{ id: item.id, quantity: seats }],
        proration_date: prorationDate,
        proration_behavior: 'always_invoice',
      },
    }),
  );
  return {
    seats,
    currentSeats: item.quantity ?? 0,
    prorationDate,
    amountDue: preview.total,
    currency: preview.currency,
    periodEnd: iso(new Date(item.current_period_end * 1000)),
    lines: preview.lines.data.map((l) => ({ description: l.description ?? '', amount: l.amount })),
  };
}

async function mirrorSubscription(subscription: Subscription, remote: Stripe.Subscription) {
  await subscription.update(subscriptionFields(remote));
}

export async function changeSeats(actor: Actor, input: unknown): Promise<{ seats: number }> {
  assertMay(actor, 'billing:manage');
  const { seats, prorationDate } = parseOrThrow(changeSeatsSchema, input);
  await assertCovers(actor, seats);
  const { subscription, remote, item } = await liveSubscription(actor);
  const before = item.quantity;
  if (seats === before) return { seats };
  const updated = await callPayments('change the seats', () =>
    stripe().subscriptions.update(remote.id, {
      items: [{ id: item.id, quantity: seats }],
      proration_behavior: 'always_invoice',
      proration_date: prorationDate,
    }),
  );
  await mirrorSubscription(subscription, updated);
  await recordAudit(actor, {
    entity: 'subscription',
    entityId: subscription.id,
    action: 'update',
    before: { seats: before },
    after: { seats },
  });
  return { seats };
}

async function setCancelAtPeriodEnd(actor: Actor, cancel: boolean) {
  assertMay(actor, 'billing:manage');
  const { subscription, remote } = await liveSubscription(actor);
  const updated = await callPayments(cancel ? 'cancel the subscription' : 'resume the subscription', () =>
    stripe().subscriptions.update(remote.id, { cancel_at_period_end: cancel }),
  );
  await mirrorSubscription(subscription, updated);
  await recordAudit(actor, {
    entity: 'subscription',
    entityId: subscription.id,
    action: cancel ? 'cancel' : 'resume',
    before: { cancelAtPeriodEnd: remote.cancel_at_period_end },
    after: { cancelAtPeriodEnd: cancel },
  });
}

/** Cancels at the end of the paid period: the seats stay until then. */
export const cancelAtPeriodEnd = (actor: Actor) => setCancelAtPeriodEnd(actor, true);
/** Undoes a pending cancellation. */
export const resumeSubscription = (actor: Actor) => setCancelAtPeriodEnd(actor, false);

// ---- webhooks

async function upsertInvoice(organizationId: number, invoice: Stripe.Invoice, transaction?: Transaction) {
  const fields = invoiceFields(invoice);
  const existing = await Invoice.findOne({ where: { stripeInvoiceId: fields.stripeInvoiceId }, transaction });
  if (existing) {
    if (existing.organizationId === organizationId) await existing.update(fields, { transaction });
    return;
  }
  await Invoice.create({ ...fields, organizationId }, { transaction });
}

/** The organisation's subscription row for a customer or the organisation named in metadata. */
async function rowFor(
  customer: string | null,
  metadata: Record<string, string> | null | undefined,
  transaction: Transaction,
): Promise<Subscription | null> {
  if (customer) {
    const byCustomer = await Subscription.findOne({
      where: { stripeCustomerId: customer },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    if (byCustomer) return byCustomer;
  }
  const organizationId = organizationIdFrom(metadata);
  if (!organizationId) return null;
  const byOrg = await Subscription.findOne({
    where: { organizationId },
    transaction,
    lock: transaction.LOCK.UPDATE,
  });
  if (byOrg) return byOrg;
  if (!(await Organization.findByPk(organizationId, { transaction }))) return null;
  return Subscription.create({ organizationId, status: 'incomplete', seats: 0 }, { transaction });
}

async function applySubscription(remote: Stripe.Subscription, transaction: Transaction) {
  const row = await rowFor(customerIdOf(remote), remote.metadata, transaction);
  if (!row) return null;
  // An older subscription's late event must not overwrite the live one that replaced it.
  if (row.stripeSubscriptionId && row.stripeSubscriptionId !== remote.id && isLive(row))
    return row.organizationId;
  await row.update(subscriptionFields(remote), { transaction });
  return row.organizationId;
}

async function applyEvent(
  event: Stripe.Event,
  related: Stripe.Subscription | null,
  transaction: Transaction,
) {
  switch (event.type) {
    case 'customer.subscription.created':
    case 'customer.subscription.updated':
    case 'customer.subscription.deleted':
      return applySubscription(event.data.object, transaction);
    case 'checkout.session.completed':
      return related ? applySubscription(related, transaction) : null;
    case 'invoice.paid':
    case 'invoice.payment_failed': {
      const invoice = event.data.object;
      const row = await rowFor(
        customerIdOf(invoice),
        invoice.parent?.subscription_details?.metadata ?? null,
        transaction,
      );
      if (!row || !invoice.id) return null;
      await upsertInvoice(row.organizationId, invoice, transaction);
      return row.organizationId;
    }
    default:
      return null;
  }
}

export type WebhookOutcome = { received: true; duplicate: boolean; type: string };

/**
 * Verifies a payment-service event on its raw body and applies it once: the event id is
 * stored in the same transaction as its effect, so a redelivered event changes nothing.
 */
export async function receiveWebhook(rawBody: string, signature: string | null): Promise<WebhookOutcome> {
  let event: Stripe.Event;
  try {
    if (!signature) throw new Error('no signature');
    event = stripe().webhooks.constructEvent(rawBody, signature, webhookSecret());
  } catch {
    throw badRequest('The webhook signature is missing or does not match; the event was ignored.');
  }
  if (await WebhookEvent.findOne({ where: { eventId: event.id } }))
    return { received: true, duplicate: true, type: event.type };
  // Read what the event points to before the transaction, so that no lock waits on the network.
  let related: Stripe.Subscription | null = null;
  if (event.type === 'checkout.session.completed') {
    const session = event.data.object;
    const id = typeof session.subscription === 'string' ? session.subscription : session.subscription?.id;
    if (id) related = await callPayments('read the subscription', () => stripe().subscriptions.retrieve(id));
  }
  try {
    await sequelize.transaction(async (transaction) => {
      const record = await WebhookEvent.create(
        { eventId: event.id, type: event.type, organizationId: null },
        { transaction },
      );
      const organizationId = await applyEvent(event, related, transaction);
      if (organizationId) await record.update({ organizationId }, { transaction });
    });
  } catch (error) {
    // Two deliveries of one event at once: the second loses the race on the unique id.
    if (
      error instanceof UniqueConstraintError &&
      (await WebhookEvent.findOne({ where: { eventId: event.id } }))
    )
      return { received: true, duplicate: true, type: event.type };
    throw error;
  }
  return { received: true, duplicate: false, type: event.type };
}
