import 'server-only';
/**
 * Is this web instance usable? For load balancers and orchestrators: no session, nothing
 * secret, nothing of any organisation. The database must answer; in queue mode Redis too (runs
 * are enqueued there). Without a worker the app still serves, but runs only wait: degraded.
 * Every probe has a short time limit, and one answer serves every probe of the next second,
 * so a balancer polling hard (or many at once) costs one round of checks per second.
 */
import { QueryTypes } from 'sequelize';
import { Queue } from 'bullmq';
import type { Redis } from 'ioredis';
import { sequelize } from '@/models';
import { queuePrefix, redisConnection, redisUrl, RUN_QUEUE } from '@/lib/queue/redis';
import { queueCounts } from '@/lib/services/runs/queue';
import { healthStatus, type HealthStatus } from '@/lib/server/health-status';

export type Probe = { ok: boolean; ms: number };
export type QueueCounts = { waiting: number; active: number; delayed: number; failed: number };
export type Health = {
  status: HealthStatus;
  mode: 'embedded' | 'queue';
  database: Probe;
  redis: Probe | 'not used';
  /** null when the counts could not be read (Redis down). */
  queue: QueueCounts | null;
  /** Worker processes connected to the run queue; in embedded mode this process is the one. */
  workers: number | null;
};

export const PROBE_MS = 1_500;
const CACHE_MS = 1_000;

async function timed(check: () => Promise<unknown>): Promise<Probe> {
  const started = performance.now();
  let timer: NodeJS.Timeout | undefined;
  const limit = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error('timed out')), PROBE_MS);
  });
  try {
    await Promise.race([check(), limit]);
    return { ok: true, ms: Math.round(performance.now() - started) };
  } catch {
    return { ok: false, ms: Math.round(performance.now() - started) };
  } finally {
    clearTimeout(timer);
  }
}

/**
 * Whether the connection is (or within `ms` becomes) ready. The shared connections queue
 * commands while Redis is away: asking only once connected means probes during an outage pile
 * nothing up, and the first probe after start waits for the connection instead of failing.
 */
function whenReady(connection: Redis, ms: number): Promise<boolean> {
  if (connection.status === 'ready') return Promise.resolve(true);
  return new Promise((resolve) => {
    const done = (ready: boolean) => {
      clearTimeout(timer);
      connection.off('ready', onReady);
      resolve(ready);
    };
    const onReady = () => done(true);
    const timer = setTimeout(() => done(false), ms);
    connection.on('ready', onReady);
  });
}

const pingDatabase = () => sequelize.query('SELECT 1', { type: QueryTypes.SELECT });

type HealthHolder = {
  outturnHealthQueue?: { connection: Redis; prefix: string; queue: Queue };
  outturnHealth?: { at: number; answer: Promise<Health> };
};
const holder = globalThis as unknown as HealthHolder;

/** A read-only handle on the run queue, on its own connection (it never blocks the others). */
function runQueue(connection: Redis): Queue {
  const prefix = queuePrefix();
  const held = holder.outturnHealthQueue;
  if (held && held.connection === connection && held.prefix === prefix) return held.queue;
  const queue = new Queue(RUN_QUEUE, { connection, prefix });
  holder.outturnHealthQueue = { connection, prefix, queue };
  return queue;
}

async function queueHealth(): Promise<Pick<Health, 'redis' | 'queue' | 'workers'>> {
  const connection = redisConnection('health');
  const redis = await timed(async () => {
    if (!(await whenReady(connection, PROBE_MS))) throw new Error('not connected');
    await connection.ping();
  });
  if (!redis.ok) return { redis, queue: null, workers: null };
  let queue: QueueCounts | null = null;
  let workers: number | null = null;
  await timed(async () => {
    const queueOf = runQueue(connection);
    const [counts, seen] = await Promise.all([
      queueOf.getJobCounts('waiting', 'active', 'delayed', 'failed'),
      queueOf.getWorkersCount(),
    ]);
    queue = {
      waiting: counts.waiting,
      active: counts.active,
      delayed: counts.delayed,
      failed: counts.failed,
    };
    workers = seen;
  });
  return { redis, queue, workers };
}

/** The embedded mode's queue: this process's own (it neither delays nor keeps failed jobs). */
function embeddedHealth(): Pick<Health, 'redis' | 'queue' | 'workers'> {
  const { waiting, active } = queueCounts();
  return { redis: 'not used', queue: { waiting, active, delayed: 0, failed: 0 }, workers: 1 };
}

/** Runs every check now. */
export async function checkHealth(): Promise<Health> {
  const queueMode = redisUrl() !== null;
  const [database, rest] = await Promise.all([
    timed(pingDatabase),
    queueMode ? queueHealth() : Promise.resolve(embeddedHealth()),
  ]);
  const status = healthStatus({
    databaseOk: database.ok,
    redisOk: rest.redis === 'not used' ? null : rest.redis.ok,
    queueRead: rest.queue !== null,
    workers: rest.workers,
  });
  return { status, mode: queueMode ? 'queue' : 'embedded', database, ...rest };
}

/** The answer of the last second, or a fresh one (probes arriving together share it). */
export function currentHealth(now = Date.now()): Promise<Health> {
  const last = holder.outturnHealth;
  if (last && now - last.at < CACHE_MS) return last.answer;
  const answer = checkHealth();
  holder.outturnHealth = { at: now, answer };
  return answer;
}
