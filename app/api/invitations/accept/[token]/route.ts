import { NextResponse } from 'next/server';
import { handle, readJson } from '@/lib/http/route';
import { currentUser } from '@/lib/auth/guard';
import { acceptInvitation } from '@/lib/services/members';

// Public: the token is the proof for a new account; an existing account must be signed in.
export const POST = handle(async (request: Request, ctx: { params: Promise<{ token: string }> }) => {
  const { token } = await ctx.params;
  const user = await currentUser();
  return NextResponse.json(await acceptInvitation(token, await readJson(request), user));
});
