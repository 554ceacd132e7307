import { NextResponse } from 'next/server';
import { handle } from '@/lib/http/route';
import { receiveWebhook } from '@/lib/services/billing';

// Public: the payment service proves itself with the signature over the raw body,
// so the body is read as text and never parsed before it is verified.
export const POST = handle(async (request: Request) => {
  const raw = await request.text();
  const outcome = await receiveWebhook(raw, request.headers.get('stripe-signature'));
  return NextResponse.json(outcome);
});
