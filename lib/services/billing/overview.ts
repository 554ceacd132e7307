import 'server-only';
// Reads of billing for the pages: the mirror kept by the webhooks, nothing written. The seat
// price of an organisation that has never subscribed is the only thing asked of the payment
// service, once per process (see seatPrice).
import { Invoice, Subscription } from '@/models';
import type { Actor } from '@/lib/auth/actor';
import { notFound } from '@/lib/errors';
import { stripe } from '@/lib/billing/stripe';
import { PLAN_NAME, SEAT_PRICE_ID } from '@/lib/billing/plan';
import { accessOf } from '@/lib/billing/access';
import type { BillingOverview, InvoiceDetail } from '@/lib/view-types/billing';
import { seatUsage } from '../seats';
import { assertMay, isLive, iso, paymentsLog, toInvoiceView } from './common';

type Price = { unitAmount: number | null; currency: string | null };
let listPrice: Promise<Price> | undefined;

/** The subscription's own price; otherwise the plan's list price, read once and kept (a failed read is retried). */
async function seatPrice(subscription: Subscription | null): Promise<Price> {
  if (subscription?.unitAmount != null && subscription.currency)
    return { unitAmount: subscription.unitAmount, currency: subscription.currency };
  listPrice ??= stripe()
    .prices.retrieve(SEAT_PRICE_ID)
    .then((price) => ({ unitAmount: price.unit_amount, currency: price.currency }));
  try {
    return await listPrice;
  } catch (error) {
    listPrice = undefined;
    paymentsLog.error({ reason: (error as Error).message }, 'payment service: seat price read failed');
    return { unitAmount: null, currency: null };
  }
}

export async function getBillingOverview(actor: Actor): Promise<BillingOverview> {
  assertMay(actor, 'billing:read');
  const organizationId = actor.organizationId;
  const subscription = await Subscription.findOne({ where: { organizationId } });
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
  };
}

/** One invoice with its lines, read from the payment service when it answers (nothing is stored). */
export async function getInvoice(actor: Actor, invoiceId: number): Promise<InvoiceDetail> {
  assertMay(actor, 'billing:read');
  const invoice = await Invoice.findOne({ where: { id: invoiceId, organizationId: actor.organizationId } });
  if (!invoice) throw notFound('Invoice');
  let lines: InvoiceDetail['lines'] = null;
  try {
    const remote = await stripe().invoices.retrieve(invoice.stripeInvoiceId);
    lines = remote.lines.data.map((l) => ({ description: l.description ?? '', amount: l.amount }));
  } catch (error) {
    paymentsLog.error(
      { organizationId: actor.organizationId, invoiceId, reason: (error as Error).message },
      'payment service: invoice read failed',
    );
    lines = null;
  }
  return { ...toInvoiceView(invoice), lines };
}
