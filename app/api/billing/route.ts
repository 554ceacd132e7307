import { NextResponse } from 'next/server';
import { handle } from '@/lib/http/route';
import { requireActor } from '@/lib/auth/guard';
import { getBillingOverview } from '@/lib/services/billing';

export const GET = handle(async () => {
  const actor = await requireActor('billing:read');
  return NextResponse.json({ billing: await getBillingOverview(actor) });
});
