import { NextResponse } from 'next/server';
import { handle, readJson } from '@/lib/http/route';
import { requireActor } from '@/lib/auth/guard';
import { startCheckout } from '@/lib/services/billing';

/** Starts a checkout for a number of seats; the reply names the payment page to open. */
export const POST = handle(async (request: Request) => {
  const actor = await requireActor('billing:manage');
  return NextResponse.json(
    { checkout: await startCheckout(actor, await readJson(request)) },
    { status: 201 },
  );
});
