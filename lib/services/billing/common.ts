import 'server-only';
import type { Transaction } from 'sequelize';
import type Stripe from 'stripe';
import { Invoice, Subscription } from '@/models';
import type { Actor } from '@/lib/auth/actor';
import { can } from '@/lib/auth/roles';
import { badGateway, forbidden } from '@/lib/errors';
import { invoiceFields } from '@/lib/billing/mirror';
import type { InvoiceView } from '@/lib/view-types/billing';
import { componentLogger } from '@/lib/log';

/** The log of calls to the payment service. */
export const paymentsLog = componentLogger('payments');

export const iso = (d: Date | null | undefined) => (d ? d.toISOString() : null);

export function toInvoiceView(i: Invoice): InvoiceView {
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

export function assertMay(actor: Actor, action: 'billing:read' | 'billing:manage') {
  if (!can(actor.role, action)) throw forbidden('Only billing members and owners can see or change billing.');
}

/**
 * Errors of the payment service become a 502 with a message of our own: its raw text may
 * carry ids and internals, so it goes to the server log only. Nothing was changed on our side.
 */
export async function callPayments<T>(what: string, fn: () => Promise<T>): Promise<T> {
  try {
    return await fn();
  } catch (error) {
    const message = (error as { message?: string }).message ?? 'no answer';
    paymentsLog.error({ call: what, reason: message }, `payment service: ${what} failed`);
    throw badGateway(
      `The payment service could not ${what} just now. Nothing was changed; try again in a minute.`,
    );
  }
}

export const isLive = (s: Subscription | null) =>
  Boolean(s?.stripeSubscriptionId) && s!.status !== 'canceled' && s!.status !== 'incomplete_expired';

/** Writes the mirror of one payment-service invoice, never moving it to another organisation. */
export async function upsertInvoice(
  organizationId: number,
  invoice: Stripe.Invoice,
  transaction?: Transaction,
) {
  const fields = invoiceFields(invoice);
  const existing = await Invoice.findOne({ where: { stripeInvoiceId: fields.stripeInvoiceId }, transaction });
  if (existing) {
    if (existing.organizationId === organizationId) await existing.update(fields, { transaction });
    return;
  }
  await Invoice.create({ ...fields, organizationId }, { transaction });
}
