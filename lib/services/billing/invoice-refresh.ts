import 'server-only';
// The invoice list is kept by the webhooks. A billing member can ask for it to be read again
// from the payment service (after an outage of the webhooks, say): an explicit action, never
// a side effect of opening the page.
import { Subscription, sequelize } from '@/models';
import type { Actor } from '@/lib/auth/actor';
import { stripe } from '@/lib/billing/stripe';
import type { InvoiceRefresh } from '@/lib/view-types/billing';
import { assertMay, callPayments, upsertInvoice } from './common';

export async function refreshInvoices(actor: Actor): Promise<InvoiceRefresh> {
  assertMay(actor, 'billing:manage');
  const organizationId = actor.organizationId;
  const subscription = await Subscription.findOne({ where: { organizationId } });
  const customer = subscription?.stripeCustomerId;
  if (!customer) return { refreshed: 0 };
  const list = await callPayments('list the invoices', () => stripe().invoices.list({ customer, limit: 24 }));
  const invoices = list.data.filter((invoice) => invoice.id);
  await sequelize.transaction(async (transaction) => {
    for (const invoice of invoices) await upsertInvoice(organizationId, invoice, transaction);
  });
  return { refreshed: invoices.length };
}
