import { after, NextResponse } from 'next/server';
import { handle, readJson } from '@/lib/http/route';
import { logUnexpected } from '@/lib/http/log-error';
import { requestIdFrom, requestLogger } from '@/lib/log';
import { SIGN_UP_REPLY, signUp } from '@/lib/services/accounts';
import { offerResetLink } from '@/lib/services/password-reset';

// Public. The same reply whether or not the address was free: a taken address creates
// nothing, and its owner is mailed a reset link after the reply has gone.
export const POST = handle(async (request: Request) => {
  const outcome = await signUp(await readJson(request));
  if (!outcome.created) {
    after(() =>
      offerResetLink(outcome.email).catch((error: unknown) =>
        logUnexpected(
          requestLogger(requestIdFrom(request.headers)),
          'Mailing an existing account failed',
          error,
        ),
      ),
    );
  }
  return NextResponse.json({ message: SIGN_UP_REPLY }, { status: 202 });
});
