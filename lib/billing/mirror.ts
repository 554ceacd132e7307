// Maps the payment service's objects onto the columns Outturn keeps (Unix seconds → Date,
// ids rather than expanded objects). Pure: the webhook route and the billing service share it.
import type Stripe from 'stripe';
import { SUBSCRIPTION_STATUSES, type SubscriptionStatus } from '@/models/subscription';

const date = (seconds: number | null | undefined) => (seconds ? new Date(seconds * 1000) : null);
const idOf = (value: string | { id: string } | null | undefined) =>
  value == null ? null : typeof value === 'string' ? value : value.id;

function statusOf(status: Stripe.Subscription.Status): SubscriptionStatus {
  if ((SUBSCRIPTION_STATUSES as readonly string[]).includes(status)) return status as SubscriptionStatus;
  // A paused subscription collects nothing: treat it like an unpaid one.
  return 'unpaid';
}

export function subscriptionFields(subscription: Stripe.Subscription) {
  const item = subscription.items.data[0];
  return {
    status: statusOf(subscription.status),
    seats: item?.quantity ?? 0,
    unitAmount: item?.price?.unit_amount ?? null,
    currency: subscription.currency,
    stripeSubscriptionId: subscription.id,
    stripeCustomerId: idOf(subscription.customer),
    currentPeriodEnd: date(item?.current_period_end),
    cancelAtPeriodEnd: subscription.cancel_at_period_end,
    endedAt: date(subscription.ended_at),
    trialEndsAt: date(subscription.trial_end),
  };
}

export function invoiceFields(invoice: Stripe.Invoice) {
  return {
    stripeInvoiceId: invoice.id,
    number: invoice.number ?? null,
    status: invoice.status ?? 'draft',
    billingReason: invoice.billing_reason ?? null,
    total: invoice.total,
    amountPaid: invoice.amount_paid,
    currency: invoice.currency,
    periodStart: date(invoice.period_start),
    periodEnd: date(invoice.period_end),
    issuedAt: date(invoice.created) ?? new Date(),
    paidAt: date(invoice.status_transitions?.paid_at),
  };
}

export function customerIdOf(object: { customer?: string | { id: string } | null }): string | null {
  return idOf(object.customer ?? null);
}

/** The organisation id Outturn wrote into the metadata at checkout, if any. */
export function organizationIdFrom(metadata: Record<string, string> | null | undefined): number | null {
  const id = Number(metadata?.organizationId);
  return Number.isSafeInteger(id) && id > 0 ? id : null;
}
