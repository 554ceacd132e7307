import { NextResponse } from 'next/server';
import { handle } from '@/lib/http/route';
import { requireActor } from '@/lib/auth/guard';
import { refreshInvoices } from '@/lib/services/billing';

/** Reads the organisation's invoices again from the payment service (an explicit action). */
export const POST = handle(async () => {
  const actor = await requireActor('billing:manage');
  return NextResponse.json(await refreshInvoices(actor));
});
