import { NextResponse } from 'next/server';
import { handle, readJson } from '@/lib/http/route';
import { acceptInvitation } from '@/lib/services/members';

// Public: the token itself is the proof; the invitee may not have an account yet.
export const POST = handle(async (request: Request, ctx: { params: Promise<{ token: string }> }) => {
  const { token } = await ctx.params;
  return NextResponse.json(await acceptInvitation(token, await readJson(request)));
});
