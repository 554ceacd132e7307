import 'server-only';
/**
 * Rate limiters that every web instance shares. With REDIS_URL the counters live in Redis
 * (rate-limiter-flexible's RateLimiterRedis, one atomic script per hit), so a limit of five
 * failed sign-ins is five across all instances, not five per instance. Without it (embedded
 * mode, one process) they live in memory. While Redis is unreachable each instance counts in
 * its own memory instead (the insurance limiter), so signing in keeps working through an outage.
 */
import type { Redis } from 'ioredis';
import { RateLimiterMemory, RateLimiterRedis, type RateLimiterAbstract } from 'rate-limiter-flexible';
import { queuePrefix, redisConnection, redisUrl } from '@/lib/queue/redis';

export type LimitSpec = {
  /** What is counted ('signin-email'…): keeps the counters of different limits apart. */
  keyPrefix: string;
  /** Hits allowed per window. */
  points: number;
  /** The window, in seconds. */
  duration: number;
};

/**
 * The shared Redis connection of queue mode, or null in embedded mode. instrumentation.ts opens
 * it at start: a limiter treats a connection that is not ready yet like one that is down.
 */
export function limitsStore(): Redis | null {
  return redisUrl() ? redisConnection('limits') : null;
}

/** A limiter counting in `store` (Redis) when given one, else in this process's memory. */
export function createLimiter(spec: LimitSpec, store: Redis | null = limitsStore()): RateLimiterAbstract {
  if (!store) return new RateLimiterMemory(spec);
  return new RateLimiterRedis({
    ...spec,
    storeClient: store,
    // The queue prefix keeps tests, and tenants of one Redis, apart.
    keyPrefix: `${queuePrefix()}:limits:${spec.keyPrefix}`,
    // ioredis queues commands while disconnected (the shared connections retry for ever):
    // refuse at once instead and count in memory until Redis is back.
    rejectIfRedisNotReady: true,
    insuranceLimiter: new RateLimiterMemory(spec),
  });
}

/** A limit per e-mail address and one per client address. */
export type AddressLimits = { perEmail: RateLimiterAbstract; perAddress: RateLimiterAbstract };

/**
 * The limits of one form, made at first use (importing the module opens no connection) and kept
 * on globalThis under `name`: Next.js may load a module in more than one bundle of one process,
 * and every copy must count with the same limiters.
 */
export function addressLimits(name: string, perEmail: LimitSpec, perAddress: LimitSpec): () => AddressLimits {
  const holder = globalThis as unknown as Record<string, AddressLimits | undefined>;
  return () =>
    (holder[name] ??= { perEmail: createLimiter(perEmail), perAddress: createLimiter(perAddress) });
}
