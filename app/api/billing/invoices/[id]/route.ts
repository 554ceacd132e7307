import { NextResponse } from 'next/server';
import { handle } from '@/lib/http/route';
import { idParam } from '@/lib/http/params';
import { requireActor } from '@/lib/auth/guard';
import { getInvoice } from '@/lib/services/billing';

export const GET = handle(async (_request: Request, ctx: { params: Promise<{ id: string }> }) => {
  const actor = await requireActor('billing:read');
  const { id } = await ctx.params;
  return NextResponse.json({ invoice: await getInvoice(actor, idParam(id, 'Invoice')) });
});
