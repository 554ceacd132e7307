import { NextResponse } from 'next/server';
import { handle, readJson } from '@/lib/http/route';
import { requireActor } from '@/lib/auth/guard';
import { invite, listInvitations } from '@/lib/services/members';

export const GET = handle(async () => {
  const actor = await requireActor('members:manage');
  return NextResponse.json({ invitations: await listInvitations(actor) });
});

export const POST = handle(async (request: Request) => {
  const actor = await requireActor('members:manage');
  return NextResponse.json({ invitation: await invite(actor, await readJson(request)) }, { status: 201 });
});
