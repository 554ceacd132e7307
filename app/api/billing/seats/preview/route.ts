import { NextResponse } from 'next/server';
import { handle, readJson } from '@/lib/http/route';
import { requireActor } from '@/lib/auth/guard';
import { previewSeatChange } from '@/lib/services/billing';

/** What a change of seats would charge now (prorated by the payment service); changes nothing. */
export const POST = handle(async (request: Request) => {
  const actor = await requireActor('billing:manage');
  return NextResponse.json({ preview: await previewSeatChange(actor, await readJson(request)) });
});
