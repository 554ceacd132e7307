// The operations side of a web instance: the health endpoint (embedded on the test run's own
// server; queue mode on a second server of the same build with REDIS_URL), the request id in
// replies and in the JSON log, the reset limits counted in Redis, and a graceful SIGTERM.
import crypto from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Queue, Worker } from 'bullmq';
import { Redis } from 'ioredis';
import { APP_URL, uniqueEmail } from './helpers/http';
import { closeDb, count } from './helpers/db';
import { sparePort, startAppInstance, waitForLine, type AppInstance } from './helpers/app-instance';
import { RUN_QUEUE } from '@/lib/queue/redis';

const REDIS = process.env.REDIS_TEST_URL ?? 'redis://127.0.0.1:6400';
const HEALTH_KEYS = ['database', 'mode', 'queue', 'redis', 'status', 'workers'];
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/;
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function health(base: string) {
  const res = await fetch(`${base}/api/health`);
  return { status: res.status, headers: res.headers, body: (await res.json()) as Record<string, any> };
}

describe('GET /api/health, embedded (the test run’s server has no REDIS_URL)', () => {
  it('answers 200 without a session, with the database’s probe and this process’s queue', async () => {
    const res = await health(APP_URL);
    expect(res.status).toBe(200);
    expect(Object.keys(res.body).sort()).toEqual(HEALTH_KEYS);
    expect(res.body.status).toBe('ok');
    expect(res.body.mode).toBe('embedded');
    expect(res.body.database.ok).toBe(true);
    expect(res.body.database.ms).toBeGreaterThanOrEqual(0);
    expect(res.body.redis).toBe('not used');
    for (const k of ['waiting', 'active', 'delayed', 'failed'])
      expect(Number.isInteger(res.body.queue[k])).toBe(true);
    expect(res.body.workers).toBe(1);
    expect(res.headers.get('cache-control')).toBe('no-store');
    expect(res.headers.getSetCookie()).toEqual([]);
    // Nothing of the settings: no database name, user or host, no secret.
    const text = JSON.stringify(res.body);
    for (const secret of [process.env.DB_NAME, process.env.DB_USER, process.env.NEXTAUTH_SECRET, '127.0.0.1'])
      if (secret) expect(text).not.toContain(secret);
  });

  it('echoes a caller’s request id on API replies and pages, and makes one when there is none', async () => {
    const id = `probe-${crypto.randomUUID()}`;
    const api = await fetch(`${APP_URL}/api/projects`, { headers: { 'x-request-id': id } });
    expect(api.status).toBe(401);
    expect(api.headers.get('x-request-id')).toBe(id);
    const forged = await fetch(`${APP_URL}/api/projects`, {
      headers: { 'x-request-id': 'x {"level":"fatal"}' },
    });
    expect(forged.headers.get('x-request-id')).toMatch(UUID);
    const page = await fetch(`${APP_URL}/sign-in`);
    expect(page.headers.get('x-request-id')).toMatch(UUID);
  });
});

describe('a second web instance in queue mode (REDIS_URL = the test run’s Redis)', () => {
  const prefix = `ops-test-${crypto.randomBytes(4).toString('hex')}`;
  let app: AppInstance;
  let queue: Queue;
  let redis: Redis;

  beforeAll(async () => {
    redis = new Redis(REDIS, { maxRetriesPerRequest: null });
    queue = new Queue(RUN_QUEUE, { connection: redis, prefix });
    app = await startAppInstance(sparePort(5), {
      REDIS_URL: REDIS,
      OUTTURN_QUEUE_PREFIX: prefix,
      LOG_LEVEL: 'info',
    });
  }, 120_000);

  afterAll(async () => {
    await queue?.obliterate({ force: true }).catch(() => undefined);
    await queue?.close();
    const keys = await redis.keys(`${prefix}:*`);
    if (keys.length) await redis.del(...keys);
    redis?.disconnect();
    await closeDb();
  });

  it('reports the run queue’s counts, and degraded while no worker is connected', async () => {
    await queue.add('probe', { n: 1 });
    await queue.add('probe', { n: 2 });
    await queue.add('probe', { n: 3 }, { delay: 60_000 });
    const res = await health(app.url);
    expect(res.status).toBe(200);
    expect(res.body.mode).toBe('queue');
    expect(res.body.database.ok).toBe(true);
    expect(res.body.redis.ok).toBe(true);
    expect(res.body.queue).toEqual({ waiting: 2, active: 0, delayed: 1, failed: 0 });
    expect(res.body.workers).toBe(0);
    expect(res.body.status).toBe('degraded');
  });

  it('sees a worker connected to the queue, and is then ok', async () => {
    const worker = new Worker(RUN_QUEUE, async () => 'done', {
      connection: new Redis(REDIS, { maxRetriesPerRequest: null }),
      prefix,
    });
    try {
      await worker.waitUntilReady();
      let body: Record<string, any> = {};
      // One answer serves a second of probes: ask again until the worker shows.
      for (let i = 0; i < 20 && body.workers !== 1; i++) {
        await sleep(300);
        body = (await health(app.url)).body;
      }
      expect(body.workers).toBe(1);
      expect(body.status).toBe('ok');
    } finally {
      await worker.close();
      (worker.opts.connection as Redis).disconnect();
    }
  });

  it('writes one JSON log line per API request, with its id, method, path, status and duration', async () => {
    const id = `log-${crypto.randomUUID()}`;
    const res = await fetch(`${app.url}/api/projects`, { headers: { 'x-request-id': id } });
    expect(res.status).toBe(401);
    expect(res.headers.get('x-request-id')).toBe(id);
    const line = await waitForLine(app, (l) => l.requestId === id);
    expect(line).toMatchObject({
      level: 'info',
      msg: 'request',
      method: 'GET',
      path: '/api/projects',
      status: 401,
    });
    expect(typeof line!.ms).toBe('number');
    expect(typeof line!.time).toBe('string');
  });

  it('counts reset requests in Redis, where every instance reads the same counters', async () => {
    const email = uniqueEmail('ops-limit');
    const res = await fetch(`${app.url}/api/password-reset`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'x-forwarded-for': '10.77.0.1' },
      body: JSON.stringify({ email }),
    });
    expect(res.status).toBe(202);
    expect(await redis.get(`${prefix}:limits:reset-email:${email}`)).toBe('1');
    expect(await redis.get(`${prefix}:limits:reset-ip:10.77.0.1`)).toBe('1');
  });

  it('on SIGTERM answers the request in flight, then closes its work and connections and exits 0', async () => {
    // A sign-up whose body is still arriving when the signal comes: the request is in flight,
    // and the handler needs the database after the signal, so the pool must still be open.
    const email = uniqueEmail('ops-shutdown');
    const encoder = new TextEncoder();
    let sendRest!: () => void;
    const body = new ReadableStream<Uint8Array>({
      start(controller) {
        controller.enqueue(encoder.encode(`{"name":"Late","organizationName":"Late Ltd",`));
        sendRest = () => {
          controller.enqueue(encoder.encode(`"email":"${email}","password":"correct horse battery"}`));
          controller.close();
        };
      },
    });
    const init = { method: 'POST', headers: { 'content-type': 'application/json' }, body, duplex: 'half' };
    const inFlight = fetch(`${app.url}/api/sign-up`, init as RequestInit);
    await sleep(500);
    const stopped = app.stop('SIGTERM');
    await waitForLine(app, (l) => l.msg === 'shutting down: no new work, finishing what is in hand');
    await sleep(300);
    sendRest();
    const reply = await inFlight;
    expect(reply.status).toBe(202);
    expect(await count('Users', 'email = ?', [email])).toBe(1);

    const { code, ms } = await stopped;
    expect(code).toBe(0);
    expect(ms).toBeLessThan(10_000);
    const lines = app.lines();
    const steps = lines.filter((l) => l.msg === 'shutdown step done').map((l) => l.step);
    // The background work stops first; then the connections close (in either order).
    expect(steps.slice(0, 2)).toEqual(['mail sender', 'run sweeper']);
    expect(steps.slice(2).sort()).toEqual(['database', 'redis']);
    // The database closed only after the request in flight was answered.
    const answered = lines.findIndex((l) => l.msg === 'request' && l.path === '/api/sign-up');
    const closed = lines.findIndex((l) => l.msg === 'shutdown step done' && l.step === 'database');
    expect(answered).toBeGreaterThanOrEqual(0);
    expect(answered).toBeLessThan(closed);
    expect(lines.some((l) => l.msg === 'shut down' && l.code === 0)).toBe(true);
  });
});
