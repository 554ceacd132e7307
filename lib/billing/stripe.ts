import 'server-only';
import Stripe from 'stripe';

// The official SDK for every call to the payment service. Locally (and in tests) it points
// at the fake on loopback by host, port and protocol; nothing else differs from production,
// where STRIPE_FAKE_PORT is unset.
let client: Stripe | undefined;

function connection(): Stripe.StripeConfig {
  const fakePort = process.env.STRIPE_FAKE_PORT;
  const base: Stripe.StripeConfig = { telemetry: false, maxNetworkRetries: fakePort ? 0 : 2 };
  return fakePort ? { ...base, host: '127.0.0.1', port: Number(fakePort), protocol: 'http' } : base;
}

export function stripe(): Stripe {
  const key = process.env.STRIPE_SECRET_KEY;
  if (!key) throw new Error('STRIPE_SECRET_KEY is not set.');
  client ??= new Stripe(key, connection());
  return client;
}

export function webhookSecret(): string {
  const secret = process.env.STRIPE_WEBHOOK_SECRET;
  if (!secret) throw new Error('STRIPE_WEBHOOK_SECRET is not set.');
  return secret;
}

export type { Stripe };
