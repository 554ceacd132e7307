// What two web instances must agree on, tested with the services themselves against the test
// database and the test run's Redis: the rate limits' shared counters, and the health check
// when Redis cannot be reached.
import crypto from 'node:crypto';
import { closedPort } from './helpers/ports';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { Redis } from 'ioredis';
import { RateLimiterRes, type RateLimiterAbstract } from 'rate-limiter-flexible';
import { createLimiter } from '@/lib/limits/rate-limiter';
import { checkHealth, PROBE_MS } from '@/lib/services/health';
import { closeRedisConnections } from '@/lib/queue/redis';
import { sequelize } from '@/models';

const REDIS = process.env.REDIS_TEST_URL ?? 'redis://127.0.0.1:6400';
const spec = { keyPrefix: 'ops-test', points: 5, duration: 60 };

/** Consumes a point; the limiter's refusal (a RateLimiterRes) is returned rather than thrown. */
const hit = (limiter: RateLimiterAbstract, key: string) =>
  limiter.consume(key).then(
    (res) => ({ refused: false, res }),
    (e: unknown) => {
      if (e instanceof RateLimiterRes) return { refused: true, res: e };
      throw e;
    },
  );

const savedEnv = { REDIS_URL: process.env.REDIS_URL, OUTTURN_QUEUE_PREFIX: process.env.OUTTURN_QUEUE_PREFIX };

beforeAll(() => {
  process.env.OUTTURN_QUEUE_PREFIX = `ops-test-${crypto.randomBytes(4).toString('hex')}`;
});

afterEach(async () => {
  await closeRedisConnections();
  if (savedEnv.REDIS_URL === undefined) delete process.env.REDIS_URL;
  else process.env.REDIS_URL = savedEnv.REDIS_URL;
});

afterAll(async () => {
  const redis = new Redis(REDIS);
  const keys = await redis.keys(`${process.env.OUTTURN_QUEUE_PREFIX}:*`);
  if (keys.length) await redis.del(...keys);
  redis.disconnect();
  process.env.OUTTURN_QUEUE_PREFIX = savedEnv.OUTTURN_QUEUE_PREFIX;
  await sequelize.close();
});

describe('rate limits in queue mode', () => {
  it('two limiters on two connections (two web instances) count on the same counter', async () => {
    const a = new Redis(REDIS, { maxRetriesPerRequest: null });
    const b = new Redis(REDIS, { maxRetriesPerRequest: null });
    try {
      // Connected, as the server's connection is from its start (instrumentation.ts).
      await Promise.all([a.ping(), b.ping()]);
      const onA = createLimiter(spec, a);
      const onB = createLimiter(spec, b);
      const key = `someone-${crypto.randomUUID()}@test.example`;
      for (let i = 0; i < 3; i++) expect((await hit(onA, key)).refused).toBe(false);
      for (let i = 0; i < 2; i++) expect((await hit(onB, key)).refused).toBe(false);
      // Five of five used, three on one instance and two on the other: the sixth is refused on both.
      expect((await onB.get(key))!.consumedPoints).toBe(5);
      const sixth = await hit(onA, key);
      expect(sixth.refused).toBe(true);
      expect(sixth.res.remainingPoints).toBe(0);
      expect(sixth.res.msBeforeNext).toBeGreaterThan(0);
      expect((await hit(onB, key)).refused).toBe(true);
      // A reset on one (a successful sign-in) frees the other.
      await onB.delete(key);
      expect((await hit(onA, key)).refused).toBe(false);
    } finally {
      a.disconnect();
      b.disconnect();
    }
  });

  it('limiters in memory (embedded mode) count apart: the reason queue mode keeps them in Redis', async () => {
    const one = createLimiter(spec, null);
    const two = createLimiter(spec, null);
    const key = 'x@test.example';
    for (let i = 0; i < 5; i++) await hit(one, key);
    expect((await hit(one, key)).refused).toBe(true);
    expect((await hit(two, key)).refused).toBe(false);
  });

  it('counts in memory at once while Redis is unreachable, rather than waiting for it', async () => {
    const away = new Redis(`redis://127.0.0.1:${await closedPort()}`, {
      maxRetriesPerRequest: null,
      retryStrategy: () => 1_000,
    });
    away.on('error', () => undefined);
    try {
      const limiter = createLimiter(spec, away);
      const key = 'offline@test.example';
      for (let i = 0; i < 5; i++) expect((await hit(limiter, key)).refused).toBe(false);
      expect((await hit(limiter, key)).refused).toBe(true);
    } finally {
      away.disconnect();
    }
  });
});

describe('the health check', () => {
  it('is down (503 at the route) when Redis cannot be reached in queue mode, with the database still up', async () => {
    process.env.REDIS_URL = `redis://127.0.0.1:${await closedPort()}`;
    const started = performance.now();
    const health = await checkHealth();
    expect(performance.now() - started).toBeLessThan(PROBE_MS + 1_000);
    expect(health.status).toBe('down');
    expect(health.mode).toBe('queue');
    expect(health.database.ok).toBe(true);
    expect(health.redis).toMatchObject({ ok: false });
    expect(health.queue).toBeNull();
    expect(health.workers).toBeNull();
  });

  it('reads Redis and the queue on a fresh connection, and is degraded with no worker', async () => {
    process.env.REDIS_URL = REDIS;
    const health = await checkHealth();
    expect(health.redis).toMatchObject({ ok: true });
    expect(health.queue).toEqual({ waiting: 0, active: 0, delayed: 0, failed: 0 });
    expect(health.workers).toBe(0);
    expect(health.status).toBe('degraded');
  });

  it('is ok in embedded mode with the database up, and says Redis is not used', async () => {
    delete process.env.REDIS_URL;
    const health = await checkHealth();
    expect(health).toMatchObject({ status: 'ok', mode: 'embedded', redis: 'not used', workers: 1 });
    expect(health.database.ok).toBe(true);
  });
});
