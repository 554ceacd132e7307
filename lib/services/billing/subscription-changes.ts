import 'server-only';
// What a billing member changes: the trial, checkout, the number of seats, cancel and resume.
// Each change goes to the payment service first; the mirror is updated from its answer.
import type { Transaction } from 'sequelize';
import type Stripe from 'stripe';
import { Organization, Subscription } from '@/models';
import type { Actor } from '@/lib/auth/actor';
import { badGateway, badRequest } from '@/lib/errors';
import { parseOrThrow } from '@/lib/validation/parse';
import { stripe } from '@/lib/billing/stripe';
import { SEAT_PRICE_ID, TRIAL_DAYS, TRIAL_SEATS } from '@/lib/billing/plan';
import { changeSeatsSchema, seatsSchema } from '@/lib/billing/schemas';
import { customerIdOf, subscriptionFields } from '@/lib/billing/mirror';
import type { SeatChangePreview } from '@/lib/view-types/billing';
import { recordAudit } from '../audit';
import { seatUsage } from '../seats';
import { assertMay, callPayments, isLive, iso, paymentsLog } from './common';

const trialFields = () => ({
  status: 'trialing' as const,
  seats: TRIAL_SEATS,
  trialEndsAt: new Date(Date.now() + TRIAL_DAYS * 24 * 3600 * 1000),
});

/** New organisations try the product with 3 paid seats for 14 days (called inside sign-up's transaction). */
export async function startTrial(organizationId: number, transaction: Transaction): Promise<void> {
  await Subscription.create({ organizationId, ...trialFields() }, { transaction });
}

async function subscriptionFor(actor: Actor): Promise<Subscription> {
  const existing = await Subscription.findOne({ where: { organizationId: actor.organizationId } });
  if (existing) return existing;
  // An organisation made before billing existed: it starts the usual trial now.
  return Subscription.create({ organizationId: actor.organizationId, ...trialFields() });
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
  if (!session.url) {
    paymentsLog.error(
      { organizationId: actor.organizationId, session: session.id },
      'payment service: checkout session has no url',
    );
    throw badGateway(
      'The payment service gave no checkout page. Nothing was charged; try again in a minute.',
    );
  }
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
  if (!item) {
    paymentsLog.error(
      { organizationId: actor.organizationId, subscription: remote.id },
      'payment service: subscription has no seat item',
    );
    throw badGateway(
      'The payment service holds no seats for this subscription. Write to us to have it fixed.',
    );
  }
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
