// The shapes of the payment service's objects, as far as Outturn reads them. The fake keeps
// them in memory and returns them as the real service would (snake_case, Unix seconds).

export type Json = Record<string, unknown>;

export const now = () => Math.floor(Date.now() / 1000);
export const DAY = 24 * 3600;
/** The fake bills in 30-day periods. */
export const PERIOD = 30 * DAY;

export function newId(prefix: string): string {
  const alphabet = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789';
  let s = '';
  for (let i = 0; i < 24; i++) s += alphabet[Math.floor(Math.random() * alphabet.length)];
  return `${prefix}_${s}`;
}

export function listOf<T>(data: T[], url: string) {
  return { object: 'list', data, has_more: false, url };
}

export type Price = {
  id: string;
  object: 'price';
  active: true;
  currency: string;
  unit_amount: number;
  unit_amount_decimal: string;
  nickname: string;
  product: string;
  recurring: { interval: 'month'; interval_count: 1; usage_type: 'licensed' };
  type: 'recurring';
  livemode: false;
  metadata: Record<string, string>;
  created: number;
};

export type Customer = {
  id: string;
  object: 'customer';
  email: string | null;
  name: string | null;
  metadata: Record<string, string>;
  created: number;
  livemode: false;
};

export type SubscriptionItem = {
  id: string;
  object: 'subscription_item';
  price: Price;
  quantity: number;
  current_period_start: number;
  current_period_end: number;
  subscription: string;
  created: number;
  metadata: Record<string, string>;
};

export type SubscriptionStatus = 'active' | 'past_due' | 'canceled' | 'trialing' | 'incomplete';

export type Subscription = {
  id: string;
  object: 'subscription';
  customer: string;
  status: SubscriptionStatus;
  cancel_at_period_end: boolean;
  cancel_at: number | null;
  canceled_at: number | null;
  ended_at: number | null;
  created: number;
  start_date: number;
  billing_cycle_anchor: number;
  collection_method: 'charge_automatically';
  currency: string;
  metadata: Record<string, string>;
  latest_invoice: string | null;
  items: ReturnType<typeof listOf<SubscriptionItem>>;
  trial_start: null;
  trial_end: null;
  livemode: false;
};

export type InvoiceLine = {
  id: string;
  object: 'line_item';
  amount: number;
  currency: string;
  description: string;
  quantity: number;
  period: { start: number; end: number };
};

export type Invoice = {
  id: string;
  object: 'invoice';
  customer: string;
  number: string | null;
  status: 'draft' | 'open' | 'paid';
  billing_reason: 'subscription_create' | 'subscription_update' | 'subscription_cycle' | 'manual' | null;
  currency: string;
  subtotal: number;
  total: number;
  amount_due: number;
  amount_paid: number;
  amount_remaining: number;
  attempt_count: number;
  attempted: boolean;
  created: number;
  period_start: number;
  period_end: number;
  status_transitions: { finalized_at: number | null; paid_at: number | null };
  parent: {
    type: 'subscription_details';
    quote_details: null;
    subscription_details: { subscription: string; metadata: Record<string, string> };
  } | null;
  lines: ReturnType<typeof listOf<InvoiceLine>>;
  hosted_invoice_url: string | null;
  livemode: false;
  metadata: Record<string, string>;
};

export type CheckoutSession = {
  id: string;
  object: 'checkout.session';
  mode: 'subscription';
  status: 'open' | 'complete' | 'expired';
  payment_status: 'unpaid' | 'paid';
  customer: string | null;
  customer_email: string | null;
  client_reference_id: string | null;
  metadata: Record<string, string>;
  subscription: string | null;
  invoice: string | null;
  url: string | null;
  success_url: string;
  cancel_url: string | null;
  amount_subtotal: number;
  amount_total: number;
  currency: string;
  created: number;
  expires_at: number;
  livemode: false;
};

export type StripeEvent = {
  id: string;
  object: 'event';
  api_version: string;
  created: number;
  type: string;
  data: { object: Json; previous_attributes?: Json };
  livemode: false;
  pending_webhooks: number;
  request: { id: null; idempotency_key: null };
};
