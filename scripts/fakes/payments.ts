// Local fake of the payment service, on 127.0.0.1:$STRIPE_FAKE_PORT. It answers the parts of
// the HTTP API that the official SDK calls in Outturn (form-encoded bodies, `expand[]`, list
// envelopes), serves its own hosted checkout page, and POSTs signed webhook events to
// $APP_URL/api/webhooks/payments. State is in memory: a restart starts afresh (with the demo
// organisation's customer and subscription). /_control/* lets tests move time on.
import http from 'node:http';
import Stripe from 'stripe';
import demo from '../../seeders/data/demo-billing.json';
import { SEAT_PRICE_ID } from '../../lib/billing/plan';
import { checkoutPage } from './payments/checkout-page';
import { decodeParams, list, obj, str, stringMap, type Params } from './payments/form';
import { DAY, type Json, type StripeEvent } from './payments/objects';
import { FakeError, FakePaymentService } from './payments/service';

const port = Number(process.env.STRIPE_FAKE_PORT ?? 12111);
const apiKey = process.env.STRIPE_SECRET_KEY ?? 'sk_test_fake_local';
const webhookSecret = process.env.STRIPE_WEBHOOK_SECRET ?? '';
const webhookUrl = `${(process.env.APP_URL ?? 'http://localhost:3000').replace(/\/$/, '')}/api/webhooks/payments`;
const baseUrl = `http://127.0.0.1:${port}`;
const signer = new Stripe(apiKey);

/** Delivers one event, signed as the real service signs it; waits for the answer so tests are deterministic. */
async function deliver(event: StripeEvent) {
  const payload = JSON.stringify(event);
  const header = signer.webhooks.generateTestHeaderString({ payload, secret: webhookSecret });
  try {
    const res = await fetch(webhookUrl, {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'stripe-signature': header },
      body: payload,
      signal: AbortSignal.timeout(15_000),
    });
    console.log(`webhook ${event.type} ${event.id} → ${res.status}`);
  } catch (error) {
    console.log(`webhook ${event.type} ${event.id} not delivered: ${(error as Error).message}`);
  }
}

const service = new FakePaymentService(baseUrl, deliver, Stripe.API_VERSION);
service.addPrice(SEAT_PRICE_ID, 4900, 'eur', 'Outturn seat');

// The demo organisation's seeded subscription (seeders/20261201000300-demo-subscription.cjs).
{
  const start = Math.floor(Date.now() / 1000) - 10 * DAY;
  service.createCustomer({ id: demo.customer, email: 'billing@kestrelvale.example', metadata: {} });
  const sub = service.newSubscription({
    id: demo.subscription,
    itemId: demo.item,
    customer: demo.customer,
    price: service.price(SEAT_PRICE_ID),
    quantity: demo.seats,
    metadata: {},
    periodStart: start,
  });
  const item = sub.items.data[0];
  const first = service.newInvoice(
    sub,
    'subscription_create',
    [
      {
        id: 'il_demo_kestrelvale_0001',
        object: 'line_item',
        amount: item.price.unit_amount * item.quantity,
        currency: 'eur',
        description: `${item.quantity} × seat (monthly)`,
        quantity: item.quantity,
        period: { start: item.current_period_start, end: item.current_period_end },
      },
    ],
    demo.invoice,
  );
  first.created = start;
  service.markPaid(first);
  first.status_transitions.paid_at = start;
  sub.latest_invoice = first.id;
}

// ---- HTTP plumbing

type Reply = { status: number; body: unknown; headers?: Record<string, string> };
const json = (body: unknown, status = 200): Reply => ({ status, body });

function readBody(req: http.IncomingMessage): Promise<string> {
  return new Promise((resolve, reject) => {
    let data = '';
    req.setEncoding('utf8');
    req.on('data', (chunk) => (data += chunk));
    req.on('end', () => resolve(data));
    req.on('error', reject);
  });
}

const int = (v: string | undefined) => (v === undefined || v === '' ? undefined : Number(v));
const bool = (v: string | undefined) => (v === undefined ? undefined : v === 'true');

/** Replaces ids by their objects for the requested `expand[]` paths (one level, as Outturn uses it). */
function expand(object: Json, params: Params): Json {
  const out: Json = { ...object };
  for (const path of list(params, 'expand')) {
    if (typeof path !== 'string') continue;
    const id = out[path];
    if (typeof id !== 'string') continue;
    if (id.startsWith('sub_')) out[path] = service.subscription(id);
    else if (id.startsWith('cus_')) out[path] = service.customer(id);
    else if (id.startsWith('in_')) out[path] = service.invoice(id);
  }
  return out;
}

async function api(method: string, path: string[], params: Params): Promise<Reply> {
  const [resource, id, action] = path;
  if (resource === 'customers') {
    if (method === 'POST' && !id)
      return json(
        service.createCustomer({
          email: str(params, 'email'),
          name: str(params, 'name'),
          metadata: stringMap(obj(params, 'metadata')),
        }),
      );
    if (method === 'GET' && id) return json(expand(service.customer(id), params));
  }
  if (resource === 'prices' && method === 'GET' && id) return json(service.price(id));
  if (resource === 'checkout' && id === 'sessions') {
    const sessionId = action;
    if (method === 'POST' && !sessionId) {
      const lines = list(params, 'line_items').map((l) => {
        const line = l as Params;
        return { price: str(line, 'price') ?? '', quantity: Number(str(line, 'quantity') ?? 1) };
      });
      return json(
        service.createCheckoutSession({
          mode: str(params, 'mode'),
          customer: str(params, 'customer'),
          customerEmail: str(params, 'customer_email'),
          clientReferenceId: str(params, 'client_reference_id'),
          metadata: stringMap(obj(params, 'metadata')),
          subscriptionMetadata: stringMap(obj(obj(params, 'subscription_data'), 'metadata')),
          lines,
          successUrl: str(params, 'success_url'),
          cancelUrl: str(params, 'cancel_url'),
        }),
      );
    }
    if (method === 'GET' && sessionId)
      return json(expand(service.publicSession(service.session(sessionId)), params));
  }
  if (resource === 'subscriptions' && id) {
    if (method === 'GET' && !action) return json(expand(service.subscription(id), params));
    if (method === 'DELETE' && !action) return json(await service.cancelNow(id));
    if (method === 'POST' && !action) {
      const [item] = list(params, 'items') as Params[];
      return json(
        expand(
          await service.updateSubscription(id, {
            quantity: int(str(item, 'quantity')),
            itemId: str(item, 'id'),
            cancelAtPeriodEnd: bool(str(params, 'cancel_at_period_end')),
            prorationBehavior: str(params, 'proration_behavior') as never,
            prorationDate: int(str(params, 'proration_date')),
            metadata: obj(params, 'metadata') ? stringMap(obj(params, 'metadata')) : undefined,
          }),
          params,
        ),
      );
    }
  }
  if (resource === 'invoices') {
    if (method === 'POST' && id === 'create_preview') {
      const details = obj(params, 'subscription_details');
      const [item] = list(details, 'items') as Params[];
      const subscription = str(params, 'subscription');
      if (!subscription || !item)
        throw new FakeError(
          400,
          'Preview a quantity change of a subscription.',
          'subscription',
          'parameter_missing',
        );
      return json(
        service.previewQuantityChange({
          subscription,
          quantity: Number(str(item, 'quantity')),
          prorationDate: int(str(details, 'proration_date')),
          prorationBehavior: str(details, 'proration_behavior') as never,
        }),
      );
    }
    if (method === 'GET' && !id)
      return json(
        service.listInvoices({
          customer: str(params, 'customer'),
          subscription: str(params, 'subscription'),
          status: str(params, 'status'),
          limit: int(str(params, 'limit')),
        }),
      );
    if (method === 'GET' && id) return json(expand(service.invoice(id), params));
  }
  throw new FakeError(
    404,
    `Unrecognized request URL (${method}: /v1/${path.join('/')}).`,
    undefined,
    'url_invalid',
  );
}

async function hosted(method: string, path: string[], body: string): Promise<Reply> {
  const [, id, action] = path;
  const session = service.session(id);
  const price = service.price(session.line.price);
  const line = { quantity: session.line.quantity, unitAmount: price.unit_amount, nickname: price.nickname };
  const html = (message?: string, status = 200): Reply => ({
    status,
    body: checkoutPage(session, line, message),
    headers: { 'content-type': 'text/html; charset=utf-8' },
  });
  if (method === 'GET' && !action) return html();
  if (method === 'POST' && action === 'pay') {
    const card = new URLSearchParams(body).get('card') ?? '';
    const result = await service.payCheckout(id, card);
    if (!result.ok) return html(result.message, 402);
    const location = session.success_url.replace('{CHECKOUT_SESSION_ID}', session.id);
    return { status: 303, body: '', headers: { location } };
  }
  throw new FakeError(404, 'No such page.');
}

async function control(method: string, path: string[], query: URLSearchParams, body: string): Promise<Reply> {
  const [, name] = path;
  const input = (body ? JSON.parse(body) : {}) as Record<string, unknown>;
  const subscription = String(input.subscription ?? '');
  if (method === 'GET' && name === 'health') return json({ ok: true });
  if (method === 'GET' && name === 'events') {
    const type = query.get('type');
    const sub = query.get('subscription');
    const events = service.events.filter(
      (e) =>
        (!type || e.type === type) &&
        (!sub ||
          e.data.object.id === sub ||
          e.data.object.subscription === sub ||
          JSON.stringify(e).includes(sub)),
    );
    return json({ object: 'list', data: events, has_more: false });
  }
  if (method === 'POST' && name === 'redeliver') {
    await service.redeliver(String(input.event ?? ''));
    return json({ ok: true });
  }
  if (method === 'POST' && name === 'renew')
    return json(await service.renew(subscription, Boolean(input.fail)));
  if (method === 'POST' && name === 'end-subscription') return json(await service.cancelNow(subscription));
  if (method === 'POST' && name === 'pay-open-invoice')
    return json(await service.payOpenInvoice(subscription));
  throw new FakeError(404, `No control endpoint ${method} /_control/${name}.`);
}

const server = http.createServer(async (req, res) => {
  const url = new URL(req.url ?? '/', baseUrl);
  const method = req.method ?? 'GET';
  const path = url.pathname.split('/').filter(Boolean).map(decodeURIComponent);
  let reply: Reply;
  try {
    const body = await readBody(req);
    if (path[0] === 'v1') {
      if (req.headers.authorization !== `Bearer ${apiKey}`)
        throw new FakeError(401, 'Invalid API Key provided.', undefined, 'api_key_invalid');
      const params = decodeParams(method === 'GET' || method === 'DELETE' ? url.search.slice(1) : body);
      reply = await api(method, path.slice(1), params);
    } else if (path[0] === 'checkout') reply = await hosted(method, path, body);
    else if (path[0] === '_control') reply = await control(method, path, url.searchParams, body);
    else throw new FakeError(404, 'Not found.');
  } catch (error) {
    const e =
      error instanceof FakeError
        ? error
        : new FakeError(500, (error as Error).message, undefined, 'api_error');
    const type =
      e.status === 401 ? 'invalid_request_error' : e.status >= 500 ? 'api_error' : 'invalid_request_error';
    reply = json({ error: { type, code: e.code, message: e.message, param: e.param } }, e.status);
  }
  const headers = { 'content-type': 'application/json', 'request-id': `req_${Date.now()}`, ...reply.headers };
  res.writeHead(reply.status, headers);
  res.end(typeof reply.body === 'string' ? reply.body : JSON.stringify(reply.body));
});

server.listen(port, '127.0.0.1', () => {
  console.log(`Payment service fake on ${baseUrl}; webhooks to ${webhookUrl}`);
});
