import { NextResponse } from 'next/server';
import { handle } from '@/lib/http/route';
import { idParam } from '@/lib/http/params';
import { requireActor } from '@/lib/auth/guard';
import { revokeInvitation } from '@/lib/services/members';

export const DELETE = handle(async (_request: Request, ctx: { params: Promise<{ id: string }> }) => {
  const actor = await requireActor('members:manage');
  await revokeInvitation(actor, idParam((await ctx.params).id, 'Invitation'));
  return new NextResponse(null, { status: 204 });
});
