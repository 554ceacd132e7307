import 'server-only';
/**
 * The connection to Redis of queue mode. Without REDIS_URL the app runs embedded (runs execute
 * in the web server's process, limits count in its memory) and nothing here connects. With it,
 * runs wait in a BullMQ queue for worker processes, and what several web instances must agree
 * on lives in Redis.
 */

import { Redis } from 'ioredis';

/** The BullMQ queue that holds the runs waiting for a worker. */
export const RUN_QUEUE = 'outturn-runs';

/** Redis's address, or null in embedded mode. */
export function redisUrl(): string | null {
  const url = process.env.REDIS_URL?.trim();
  return url ? url : null;
}

/** The key prefix of every BullMQ key: lets tests (and tenants of one Redis) keep apart. */
export function queuePrefix(): string {
  return process.env.OUTTURN_QUEUE_PREFIX?.trim() || 'outturn';
}

/** A whole-number setting of queue mode from the environment (at least 1), or its default. */
export function positiveInt(name: string, fallback: number): number {
  const raw = process.env[name]?.trim();
  if (!raw) return fallback;
  const value = Number(raw);
  if (!Number.isInteger(value) || value < 1) {
    throw new Error(`${name} must be a whole number of at least 1; it is "${raw}".`);
  }
  return value;
}

const holder = globalThis as unknown as { outturnRedis?: Map<string, Redis> };
const connections: Map<string, Redis> = (holder.outturnRedis ??= new Map());

/**
 * One shared connection per purpose ('queue', 'limits', 'events'…): a blocking BullMQ worker
 * or a subscriber needs its own, everything else may share. `maxRetriesPerRequest: null` is what
 * BullMQ asks of the connections it is given.
 */
export function redisConnection(purpose: string): Redis {
  const url = redisUrl();
  if (!url) throw new Error('REDIS_URL is not set: the app runs embedded and has no Redis.');
  let connection = connections.get(purpose);
  if (!connection) {
    connection = new Redis(url, { maxRetriesPerRequest: null, lazyConnect: false });
    connection.on('error', () => {
      // ioredis reconnects by itself; the health endpoint reports the outage.
    });
    connections.set(purpose, connection);
  }
  return connection;
}

/** Closes every connection this process opened (graceful shutdown). */
export async function closeRedisConnections(): Promise<void> {
  const open = [...connections.values()];
  connections.clear();
  await Promise.all(open.map((c) => c.quit().catch(() => c.disconnect())));
}
