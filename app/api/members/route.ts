import { NextResponse } from 'next/server';
import { handle } from '@/lib/http/route';
import { requireActor } from '@/lib/auth/guard';
import { listMembers } from '@/lib/services/members';

export const GET = handle(async () => {
  const actor = await requireActor('members:read');
  return NextResponse.json({ members: await listMembers(actor) });
});
