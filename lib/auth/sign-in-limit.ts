import { RateLimiterRes, type RateLimiterAbstract } from 'rate-limiter-flexible';
import { addressLimits } from '@/lib/limits/rate-limiter';

// Failed sign-ins are counted per e-mail and per client address; either limit
// blocks further attempts for a while. Successful sign-ins reset the e-mail's count.
// The counters are shared by every web instance in queue mode (lib/limits/rate-limiter.ts).
const limits = addressLimits(
  'outturnSignInLimits',
  { keyPrefix: 'signin-email', points: 5, duration: 15 * 60 },
  { keyPrefix: 'signin-ip', points: 50, duration: 15 * 60 },
);

export class SignInLimited extends Error {
  constructor(readonly retryAfterSeconds: number) {
    const minutes = Math.max(1, Math.ceil(retryAfterSeconds / 60));
    super(`Too many failed sign-ins. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`);
  }
}

async function remaining(limiter: RateLimiterAbstract, key: string): Promise<number> {
  const res = await limiter.get(key);
  if (res && res.remainingPoints <= 0) return Math.ceil(res.msBeforeNext / 1000);
  return 0;
}

/** Throws SignInLimited when either counter is exhausted. */
export async function assertMaySignIn(email: string, address: string): Promise<void> {
  const { perEmail, perAddress } = limits();
  const wait = Math.max(await remaining(perEmail, email), await remaining(perAddress, address));
  if (wait > 0) throw new SignInLimited(wait);
}

export async function recordFailedSignIn(email: string, address: string): Promise<void> {
  const { perEmail, perAddress } = limits();
  await Promise.all(
    [perEmail.consume(email), perAddress.consume(address)].map((p) =>
      p.catch((e: unknown) => {
        if (!(e instanceof RateLimiterRes)) throw e;
      }),
    ),
  );
}

export async function recordSuccessfulSignIn(email: string): Promise<void> {
  await limits().perEmail.delete(email);
}
