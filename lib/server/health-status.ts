// The one word a balancer reads from the health check. Down (503): the instance cannot serve,
// because the database, or in queue mode Redis (where runs are enqueued), does not answer.
// Degraded (200): it serves, but in queue mode no worker is connected (runs would only wait) or
// the queue could not be read. Otherwise ok.

export type HealthStatus = 'ok' | 'degraded' | 'down';

export type HealthFacts = {
  databaseOk: boolean;
  /** null in embedded mode, where Redis is not used. */
  redisOk: boolean | null;
  queueRead: boolean;
  workers: number | null;
};

export function healthStatus(facts: HealthFacts): HealthStatus {
  if (!facts.databaseOk || facts.redisOk === false) return 'down';
  const queueMode = facts.redisOk !== null;
  if (queueMode && (!facts.queueRead || !facts.workers)) return 'degraded';
  return 'ok';
}
