import 'server-only';
// Events from the payment service, verified on their raw body and applied once.
//
// Events can arrive late and out of order (a retry after a failed delivery comes hours after
// the events that followed it), and their creation time has a resolution of one second, too
// coarse to order the several events that one checkout or cancellation emits. So an event
// about a subscription is taken as a notice that it changed: the subscription is read again
// from the payment service, and its current state is what is mirrored.
import { UniqueConstraintError, type Transaction } from 'sequelize';
import type Stripe from 'stripe';
import { Organization, Subscription, WebhookEvent, sequelize } from '@/models';
import { badRequest } from '@/lib/errors';
import { stripe, webhookSecret } from '@/lib/billing/stripe';
import { customerIdOf, organizationIdFrom, subscriptionFields } from '@/lib/billing/mirror';
import { callPayments, isLive, upsertInvoice } from './common';

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

async function applySubscription(current: Stripe.Subscription, transaction: Transaction) {
  const row = await rowFor(customerIdOf(current), current.metadata, transaction);
  if (!row) return null;
  // An older subscription's event must not overwrite the live one that replaced it.
  if (row.stripeSubscriptionId && row.stripeSubscriptionId !== current.id && isLive(row))
    return row.organizationId;
  await row.update(subscriptionFields(current), { transaction });
  return row.organizationId;
}

/** The id of the subscription an event is about, if it is about one. */
function subscriptionIdOf(event: Stripe.Event): string | null {
  switch (event.type) {
    case 'customer.subscription.created':
    case 'customer.subscription.updated':
    case 'customer.subscription.deleted':
      return event.data.object.id;
    case 'checkout.session.completed': {
      const { subscription } = event.data.object;
      return (typeof subscription === 'string' ? subscription : subscription?.id) ?? null;
    }
    default:
      return null;
  }
}

async function applyEvent(
  event: Stripe.Event,
  current: Stripe.Subscription | null,
  transaction: Transaction,
) {
  if (current) return applySubscription(current, transaction);
  switch (event.type) {
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
  // Read the subscription's current state before the transaction, so that no lock waits on the
  // network. If the payment service does not answer, the 502 makes it deliver the event again.
  const subscriptionId = subscriptionIdOf(event);
  const current = subscriptionId
    ? await callPayments('read the subscription', () => stripe().subscriptions.retrieve(subscriptionId))
    : null;
  try {
    await sequelize.transaction(async (transaction) => {
      const record = await WebhookEvent.create(
        { eventId: event.id, type: event.type, organizationId: null },
        { transaction },
      );
      const organizationId = await applyEvent(event, current, transaction);
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
