import { NextResponse } from 'next/server';
import { handle, readJson } from '@/lib/http/route';
import { NEUTRAL_RESET_REPLY, requestPasswordReset } from '@/lib/services/password-reset';

function clientAddress(request: Request): string {
  return (
    request.headers.get('x-forwarded-for')?.split(',')[0]?.trim() ||
    request.headers.get('x-real-ip') ||
    'local'
  );
}

// Public: anyone may ask. The reply never says whether the address has an account.
export const POST = handle(async (request: Request) => {
  await requestPasswordReset(await readJson(request), clientAddress(request));
  return NextResponse.json({ message: NEUTRAL_RESET_REPLY }, { status: 202 });
});
