// What the billing pages see: plain JSON shapes that the billing services produce and the
// components render. No server code here, so client components may import it.
import type { Access } from '@/lib/billing/access';
import type { SubscriptionStatus } from '@/models/subscription';

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

export type InvoiceDetail = InvoiceView & { lines: { description: string; amount: number }[] | null };

export type BillingOverview = {
  plan: string;
  status: SubscriptionStatus | 'none';
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

/** The answer to an explicit refresh of the invoice list from the payment service. */
export type InvoiceRefresh = { refreshed: number };
