import { NextResponse } from 'next/server';
import { handle, readJson } from '@/lib/http/route';
import { requireActor } from '@/lib/auth/guard';
import { listNotificationPreferences, setNotificationPreference } from '@/lib/services/notifications';

// Any signed-in member manages their own notices; nothing here reaches another member's choices.
export const GET = handle(async () => {
  const actor = await requireActor();
  return NextResponse.json({ preferences: await listNotificationPreferences(actor) });
});

export const PUT = handle(async (request: Request) => {
  const actor = await requireActor();
  return NextResponse.json({ preferences: await setNotificationPreference(actor, await readJson(request)) });
});
