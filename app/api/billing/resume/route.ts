import { NextResponse } from 'next/server';
import { handle } from '@/lib/http/route';
import { requireActor } from '@/lib/auth/guard';
import { resumeSubscription } from '@/lib/services/billing';

export const POST = handle(async () => {
  const actor = await requireActor('billing:manage');
  await resumeSubscription(actor);
  return NextResponse.json({ cancelAtPeriodEnd: false });
});
