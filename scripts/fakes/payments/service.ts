// The in-memory payment service behind the local fake: customers, a seat price, checkout
// sessions, subscriptions with prorated quantity changes, invoices, and the events that
// each change produces. No network here; scripts/fakes/payments.ts serves it over HTTP.
import {
  DAY,
  PERIOD,
  listOf,
  newId,
  now,
  type CheckoutSession,
  type Customer,
  type Invoice,
  type InvoiceLine,
  type Json,
  type Price,
  type StripeEvent,
  type Subscription,
} from './objects';
import { prorate } from './proration';

export class FakeError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly param?: string,
    readonly code = 'resource_missing',
  ) {
    super(message);
  }
}

export const CARD_SUCCEEDS = '4242424242424242';
export const CARD_DECLINED = '4000000000000002';

type SessionLine = { price: string; quantity: number };
type ProrationBehavior = 'create_prorations' | 'always_invoice' | 'none';

export type EventSink = (event: StripeEvent) => Promise<void>;

export class FakePaymentService {
  readonly prices = new Map<string, Price>();
  readonly customers = new Map<string, Customer>();
  readonly sessions = new Map<string, CheckoutSession & { line: SessionLine; subscriptionMetadata: Json }>();
  readonly subscriptions = new Map<string, Subscription>();
  readonly invoices = new Map<string, Invoice>();
  readonly events: StripeEvent[] = [];
  /** Prorations waiting for the next renewal invoice (proration_behavior=create_prorations). */
  private pendingLines = new Map<string, InvoiceLine[]>();
  private invoiceCounter = 0;

  constructor(
    readonly baseUrl: string,
    private readonly sink: EventSink,
    readonly apiVersion: string,
  ) {}

  addPrice(id: string, unitAmount: number, currency: string, nickname: string) {
    this.prices.set(id, {
      id,
      object: 'price',
      active: true,
      currency,
      unit_amount: unitAmount,
      unit_amount_decimal: String(unitAmount),
      nickname,
      product: 'prod_outturn_seats',
      recurring: { interval: 'month', interval_count: 1, usage_type: 'licensed' },
      type: 'recurring',
      livemode: false,
      metadata: {},
      created: now(),
    });
  }

  private async emit(type: string, object: Json, previous?: Json) {
    const event: StripeEvent = {
      id: newId('evt'),
      object: 'event',
      api_version: this.apiVersion,
      created: now(),
      type,
      data: previous
        ? { object: structuredClone(object), previous_attributes: previous }
        : { object: structuredClone(object) },
      livemode: false,
      pending_webhooks: 1,
      request: { id: null, idempotency_key: null },
    };
    this.events.push(event);
    await this.sink(event);
  }

  // ---- prices and customers

  price(id: string): Price {
    const price = this.prices.get(id);
    if (!price) throw new FakeError(404, `No such price: '${id}'`, 'price');
    return price;
  }

  createCustomer(input: { email?: string; name?: string; metadata: Record<string, string>; id?: string }) {
    const customer: Customer = {
      id: input.id ?? newId('cus'),
      object: 'customer',
      email: input.email ?? null,
      name: input.name ?? null,
      metadata: input.metadata,
      created: now(),
      livemode: false,
    };
    this.customers.set(customer.id, customer);
    return customer;
  }

  customer(id: string): Customer {
    const customer = this.customers.get(id);
    if (!customer) throw new FakeError(404, `No such customer: '${id}'`, 'id');
    return customer;
  }

  // ---- checkout

  createCheckoutSession(input: {
    mode?: string;
    customer?: string;
    customerEmail?: string;
    clientReferenceId?: string;
    metadata: Record<string, string>;
    subscriptionMetadata: Record<string, string>;
    lines: SessionLine[];
    successUrl?: string;
    cancelUrl?: string;
  }) {
    if (input.mode !== 'subscription')
      throw new FakeError(400, 'This fake supports mode=subscription only.', 'mode', 'parameter_invalid');
    if (!input.successUrl)
      throw new FakeError(400, 'Missing required param: success_url.', 'success_url', 'parameter_missing');
    if (input.lines.length !== 1)
      throw new FakeError(
        400,
        'Give exactly one line item (the seat price).',
        'line_items',
        'parameter_invalid',
      );
    const [line] = input.lines;
    const price = this.price(line.price);
    if (!Number.isInteger(line.quantity) || line.quantity < 1)
      throw new FakeError(
        400,
        'Quantity must be a positive whole number.',
        'line_items[0][quantity]',
        'parameter_invalid',
      );
    if (input.customer) this.customer(input.customer);
    const id = newId('cs_test');
    const amount = price.unit_amount * line.quantity;
    const session = {
      id,
      object: 'checkout.session' as const,
      mode: 'subscription' as const,
      status: 'open' as const,
      payment_status: 'unpaid' as const,
      customer: input.customer ?? null,
      customer_email: input.customerEmail ?? null,
      client_reference_id: input.clientReferenceId ?? null,
      metadata: input.metadata,
      subscription: null,
      invoice: null,
      url: `${this.baseUrl}/checkout/${id}`,
      success_url: input.successUrl,
      cancel_url: input.cancelUrl ?? null,
      amount_subtotal: amount,
      amount_total: amount,
      currency: price.currency,
      created: now(),
      expires_at: now() + DAY,
      livemode: false as const,
      line,
      subscriptionMetadata: input.subscriptionMetadata,
    };
    this.sessions.set(id, session);
    return this.publicSession(session);
  }

  session(id: string) {
    const session = this.sessions.get(id);
    if (!session) throw new FakeError(404, `No such checkout.session: '${id}'`, 'session');
    return session;
  }

  publicSession(
    session: CheckoutSession & { line?: SessionLine; subscriptionMetadata?: Json },
  ): CheckoutSession {
    const { line: _line, subscriptionMetadata: _meta, ...rest } = session;
    return rest;
  }

  /**
   * Pays a checkout session with a card number. The success card creates the subscription and
   * its first paid invoice; the decline card changes nothing.
   */
  async payCheckout(id: string, cardNumber: string): Promise<{ ok: true } | { ok: false; message: string }> {
    const session = this.session(id);
    if (session.status !== 'open') return { ok: false, message: 'This checkout is already complete.' };
    const digits = cardNumber.replace(/[\s-]/g, '');
    if (digits === CARD_DECLINED)
      return { ok: false, message: 'Your card was declined. No payment was taken.' };
    if (digits !== CARD_SUCCEEDS)
      return {
        ok: false,
        message: 'Use a test card: 4242 4242 4242 4242 pays, 4000 0000 0000 0002 is declined.',
      };
    const customer =
      session.customer ??
      this.createCustomer({ email: session.customer_email ?? undefined, metadata: {} }).id;
    const subscription = this.newSubscription({
      customer,
      price: this.price(session.line.price),
      quantity: session.line.quantity,
      metadata: session.subscriptionMetadata as Record<string, string>,
    });
    const item = subscription.items.data[0];
    const invoice = this.newInvoice(subscription, 'subscription_create', [
      this.line(
        item.price.unit_amount * item.quantity,
        `${item.quantity} × seat (monthly)`,
        item.quantity,
        item.current_period_start,
        item.current_period_end,
      ),
    ]);
    this.markPaid(invoice);
    subscription.latest_invoice = invoice.id;
    Object.assign(session, {
      status: 'complete',
      payment_status: 'paid',
      customer,
      subscription: subscription.id,
      invoice: invoice.id,
      url: null,
    });
    await this.emit('customer.subscription.created', subscription);
    await this.emit('invoice.paid', invoice);
    await this.emit('checkout.session.completed', this.publicSession(session));
    return { ok: true };
  }

  // ---- subscriptions

  newSubscription(input: {
    customer: string;
    price: Price;
    quantity: number;
    metadata: Record<string, string>;
    id?: string;
    itemId?: string;
    periodStart?: number;
  }): Subscription {
    const id = input.id ?? newId('sub');
    const start = input.periodStart ?? now();
    const subscription: Subscription = {
      id,
      object: 'subscription',
      customer: input.customer,
      status: 'active',
      cancel_at_period_end: false,
      cancel_at: null,
      canceled_at: null,
      ended_at: null,
      created: start,
      start_date: start,
      billing_cycle_anchor: start,
      collection_method: 'charge_automatically',
      currency: input.price.currency,
      metadata: input.metadata,
      latest_invoice: null,
      items: listOf(
        [
          {
            id: input.itemId ?? newId('si'),
            object: 'subscription_item',
            price: input.price,
            quantity: input.quantity,
            current_period_start: start,
            current_period_end: start + PERIOD,
            subscription: id,
            created: start,
            metadata: {},
          },
        ],
        `/v1/subscription_items?subscription=${id}`,
      ),
      trial_start: null,
      trial_end: null,
      livemode: false,
    };
    this.subscriptions.set(id, subscription);
    return subscription;
  }

  subscription(id: string): Subscription {
    const subscription = this.subscriptions.get(id);
    if (!subscription) throw new FakeError(404, `No such subscription: '${id}'`, 'id');
    return subscription;
  }

  private prorationLines(subscription: Subscription, newQuantity: number, prorationDate: number) {
    const item = subscription.items.data[0];
    const p = prorate({
      unitAmount: item.price.unit_amount,
      oldQuantity: item.quantity,
      newQuantity,
      periodStart: item.current_period_start,
      periodEnd: item.current_period_end,
      prorationDate,
    });
    const end = item.current_period_end;
    return [
      this.line(p.credit, `Unused time on ${item.quantity} × seat`, item.quantity, prorationDate, end),
      this.line(p.charge, `Remaining time on ${newQuantity} × seat`, newQuantity, prorationDate, end),
    ];
  }

  private assertUpdatable(subscription: Subscription) {
    if (subscription.status === 'canceled')
      throw new FakeError(
        400,
        'A canceled subscription cannot be updated.',
        'subscription',
        'resource_invalid',
      );
  }

  /** What a quantity change would invoice (POST /v1/invoices/create_preview). */
  previewQuantityChange(input: {
    subscription: string;
    quantity: number;
    prorationDate?: number;
    prorationBehavior?: ProrationBehavior;
  }): Invoice {
    const subscription = this.subscription(input.subscription);
    this.assertUpdatable(subscription);
    const item = subscription.items.data[0];
    const at = input.prorationDate ?? now();
    const lines = this.prorationLines(subscription, input.quantity, at);
    if (input.prorationBehavior !== 'always_invoice') {
      lines.push(
        this.line(
          item.price.unit_amount * input.quantity,
          `${input.quantity} × seat (next period)`,
          input.quantity,
          item.current_period_end,
          item.current_period_end + PERIOD,
        ),
      );
    }
    const preview = this.invoiceObject(
      subscription,
      'subscription_update',
      lines,
      `upcoming_${subscription.id}`,
    );
    preview.status = 'draft';
    preview.number = null;
    return preview;
  }

  async updateSubscription(
    id: string,
    input: {
      quantity?: number;
      itemId?: string;
      cancelAtPeriodEnd?: boolean;
      prorationBehavior?: ProrationBehavior;
      prorationDate?: number;
      metadata?: Record<string, string>;
    },
  ): Promise<Subscription> {
    const subscription = this.subscription(id);
    this.assertUpdatable(subscription);
    const item = subscription.items.data[0];
    if (input.itemId && input.itemId !== item.id)
      throw new FakeError(400, `No such subscription item on ${id}: '${input.itemId}'`, 'items[0][id]');
    const previous: Json = {};
    if (input.quantity !== undefined && input.quantity !== item.quantity) {
      if (!Number.isInteger(input.quantity) || input.quantity < 1)
        throw new FakeError(
          400,
          'Quantity must be a positive whole number.',
          'items[0][quantity]',
          'parameter_invalid',
        );
      const behavior = input.prorationBehavior ?? 'create_prorations';
      const lines = this.prorationLines(subscription, input.quantity, input.prorationDate ?? now());
      previous.items = structuredClone(subscription.items);
      item.quantity = input.quantity;
      if (behavior === 'always_invoice') {
        const invoice = this.newInvoice(subscription, 'subscription_update', lines);
        subscription.latest_invoice = invoice.id;
        this.markPaid(invoice);
        await this.emit('customer.subscription.updated', subscription, previous);
        await this.emit('invoice.paid', invoice);
        return subscription;
      }
      if (behavior === 'create_prorations') {
        this.pendingLines.set(id, [...(this.pendingLines.get(id) ?? []), ...lines]);
      }
    }
    if (
      input.cancelAtPeriodEnd !== undefined &&
      input.cancelAtPeriodEnd !== subscription.cancel_at_period_end
    ) {
      previous.cancel_at_period_end = subscription.cancel_at_period_end;
      subscription.cancel_at_period_end = input.cancelAtPeriodEnd;
      subscription.cancel_at = input.cancelAtPeriodEnd ? item.current_period_end : null;
      subscription.canceled_at = input.cancelAtPeriodEnd ? now() : null;
    }
    if (input.metadata) subscription.metadata = { ...subscription.metadata, ...input.metadata };
    if (Object.keys(previous).length)
      await this.emit('customer.subscription.updated', subscription, previous);
    return subscription;
  }

  /** Ends a subscription now (DELETE /v1/subscriptions/:id, or the period end after a cancellation). */
  async cancelNow(id: string): Promise<Subscription> {
    const subscription = this.subscription(id);
    if (subscription.status === 'canceled') return subscription;
    subscription.status = 'canceled';
    subscription.ended_at = now();
    subscription.canceled_at ??= now();
    await this.emit('customer.subscription.deleted', subscription);
    return subscription;
  }

  /**
   * The period ends: a subscription set to cancel ends; otherwise the next period is invoiced
   * and paid, or its payment fails and the subscription becomes past due.
   */
  async renew(id: string, fail: boolean): Promise<Subscription> {
    const subscription = this.subscription(id);
    this.assertUpdatable(subscription);
    if (subscription.cancel_at_period_end) return this.cancelNow(id);
    const item = subscription.items.data[0];
    const previous: Json = { items: structuredClone(subscription.items), status: subscription.status };
    item.current_period_start = item.current_period_end;
    item.current_period_end = item.current_period_start + PERIOD;
    const lines = [
      ...(this.pendingLines.get(id) ?? []),
      this.line(
        item.price.unit_amount * item.quantity,
        `${item.quantity} × seat (monthly)`,
        item.quantity,
        item.current_period_start,
        item.current_period_end,
      ),
    ];
    this.pendingLines.delete(id);
    const invoice = this.newInvoice(subscription, 'subscription_cycle', lines);
    subscription.latest_invoice = invoice.id;
    if (fail) {
      invoice.attempt_count = 1;
      subscription.status = 'past_due';
      await this.emit('invoice.payment_failed', invoice);
    } else {
      this.markPaid(invoice);
      subscription.status = 'active';
      await this.emit('invoice.paid', invoice);
    }
    await this.emit('customer.subscription.updated', subscription, previous);
    return subscription;
  }

  /** A retried payment of the open invoice succeeds: the subscription is active again. */
  async payOpenInvoice(id: string): Promise<Subscription> {
    const subscription = this.subscription(id);
    const invoice = subscription.latest_invoice ? this.invoices.get(subscription.latest_invoice) : undefined;
    if (!invoice || invoice.status !== 'open')
      throw new FakeError(400, 'The subscription has no open invoice.', 'subscription', 'resource_invalid');
    invoice.attempt_count += 1;
    this.markPaid(invoice);
    const previous = { status: subscription.status };
    subscription.status = 'active';
    await this.emit('invoice.paid', invoice);
    await this.emit('customer.subscription.updated', subscription, previous);
    return subscription;
  }

  // ---- invoices

  private line(
    amount: number,
    description: string,
    quantity: number,
    start: number,
    end: number,
  ): InvoiceLine {
    return {
      id: newId('il'),
      object: 'line_item',
      amount,
      currency: 'eur',
      description,
      quantity,
      period: { start, end },
    };
  }

  private invoiceObject(
    subscription: Subscription,
    reason: Invoice['billing_reason'],
    lines: InvoiceLine[],
    id = newId('in'),
  ): Invoice {
    const total = lines.reduce((sum, l) => sum + l.amount, 0);
    const starts = lines.map((l) => l.period.start);
    const ends = lines.map((l) => l.period.end);
    for (const l of lines) l.currency = subscription.currency;
    return {
      id,
      object: 'invoice',
      customer: subscription.customer,
      number: null,
      status: 'open',
      billing_reason: reason,
      currency: subscription.currency,
      subtotal: total,
      total,
      amount_due: Math.max(total, 0),
      amount_paid: 0,
      amount_remaining: Math.max(total, 0),
      attempt_count: 0,
      attempted: false,
      created: now(),
      period_start: Math.min(...starts),
      period_end: Math.max(...ends),
      status_transitions: { finalized_at: now(), paid_at: null },
      parent: {
        type: 'subscription_details',
        quote_details: null,
        subscription_details: { subscription: subscription.id, metadata: subscription.metadata },
      },
      lines: listOf(lines, `/v1/invoices/${id}/lines`),
      hosted_invoice_url: null,
      livemode: false,
      metadata: {},
    };
  }

  newInvoice(
    subscription: Subscription,
    reason: Invoice['billing_reason'],
    lines: InvoiceLine[],
    id?: string,
  ) {
    const invoice = this.invoiceObject(subscription, reason, lines, id);
    this.invoiceCounter += 1;
    invoice.number = `FAKE-${String(this.invoiceCounter).padStart(5, '0')}`;
    invoice.attempted = true;
    this.invoices.set(invoice.id, invoice);
    return invoice;
  }

  markPaid(invoice: Invoice) {
    invoice.status = 'paid';
    invoice.amount_paid = invoice.amount_due;
    invoice.amount_remaining = 0;
    invoice.attempt_count = Math.max(invoice.attempt_count, 1);
    invoice.status_transitions.paid_at = now();
  }

  invoice(id: string): Invoice {
    const invoice = this.invoices.get(id);
    if (!invoice) throw new FakeError(404, `No such invoice: '${id}'`, 'invoice');
    return invoice;
  }

  listInvoices(filter: { customer?: string; subscription?: string; status?: string; limit?: number }) {
    const rows = [...this.invoices.values()]
      .filter((i) => !filter.customer || i.customer === filter.customer)
      .filter(
        (i) => !filter.subscription || i.parent?.subscription_details.subscription === filter.subscription,
      )
      .filter((i) => !filter.status || i.status === filter.status)
      .sort((a, b) => b.created - a.created || (b.number ?? '').localeCompare(a.number ?? ''));
    const limit = Math.min(Math.max(filter.limit ?? 10, 1), 100);
    return { ...listOf(rows.slice(0, limit), '/v1/invoices'), has_more: rows.length > limit };
  }

  // ---- events

  event(id: string): StripeEvent {
    const event = this.events.find((e) => e.id === id);
    if (!event) throw new FakeError(404, `No such event: '${id}'`, 'id');
    return event;
  }

  async redeliver(id: string) {
    await this.sink(this.event(id));
  }
}
