import { NextResponse } from 'next/server';
import { handle, readJson } from '@/lib/http/route';
import { requireActor } from '@/lib/auth/guard';
import { getWorkCalendar, setWorkCalendar } from '@/lib/services/calendar';

// Every member reads the calendar its dates are counted on; only owners change it.
export const GET = handle(async () => {
  const actor = await requireActor();
  return NextResponse.json({ calendar: await getWorkCalendar(actor) });
});

export const PUT = handle(async (request: Request) => {
  const actor = await requireActor('calendar:manage');
  return NextResponse.json({ calendar: await setWorkCalendar(actor, await readJson(request)) });
});
