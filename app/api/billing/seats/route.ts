import { NextResponse } from 'next/server';
import { handle, readJson } from '@/lib/http/route';
import { requireActor } from '@/lib/auth/guard';
import { changeSeats } from '@/lib/services/billing';

export const POST = handle(async (request: Request) => {
  const actor = await requireActor('billing:manage');
  return NextResponse.json(await changeSeats(actor, await readJson(request)));
});
