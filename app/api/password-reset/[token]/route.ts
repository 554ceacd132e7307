import { NextResponse } from 'next/server';
import { handle, readJson } from '@/lib/http/route';
import { resetPassword } from '@/lib/services/password-reset';

// Public: the token from the e-mail is the proof.
export const POST = handle(async (request: Request, ctx: { params: Promise<{ token: string }> }) => {
  const { token } = await ctx.params;
  await resetPassword(token, await readJson(request));
  return NextResponse.json({ message: 'Your password is changed. Sign in with it now.' });
});
