import { after, NextResponse } from 'next/server';
import { handle, readJson } from '@/lib/http/route';
import { logUnexpected } from '@/lib/http/log-error';
import { requestIdFrom, requestLogger } from '@/lib/log';
import { clientAddress } from '@/lib/auth/client-address';
import {
  NEUTRAL_RESET_REPLY,
  requestPasswordReset,
  sendResetLinkIfAccount,
} from '@/lib/services/password-reset';

// Public: anyone may ask. The reply never says whether the address has an account, and it
// goes before the account is even looked up, so its timing says nothing either.
export const POST = handle(async (request: Request) => {
  const email = await requestPasswordReset(
    await readJson(request),
    clientAddress(request.headers.get('x-forwarded-for')),
  );
  after(() =>
    sendResetLinkIfAccount(email).catch((error: unknown) =>
      logUnexpected(requestLogger(requestIdFrom(request.headers)), 'Sending a reset link failed', error),
    ),
  );
  return NextResponse.json({ message: NEUTRAL_RESET_REPLY }, { status: 202 });
});
