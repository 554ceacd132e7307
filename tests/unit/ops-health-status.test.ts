// The health check's one word, from the probes' outcomes (the rule in lib/server/health-status.ts:
// down = cannot serve → 503; degraded = serves but runs would wait → 200).
import { describe, expect, it } from 'vitest';
import { healthStatus } from '@/lib/server/health-status';

describe('the health status', () => {
  it('is down whenever the database does not answer, in either mode', () => {
    expect(healthStatus({ databaseOk: false, redisOk: null, queueRead: true, workers: 1 })).toBe('down');
    expect(healthStatus({ databaseOk: false, redisOk: true, queueRead: true, workers: 3 })).toBe('down');
  });

  it('is down in queue mode when Redis does not answer, even with the database up', () => {
    expect(healthStatus({ databaseOk: true, redisOk: false, queueRead: false, workers: null })).toBe('down');
  });

  it('is degraded in queue mode with no worker, or with the queue unreadable', () => {
    expect(healthStatus({ databaseOk: true, redisOk: true, queueRead: true, workers: 0 })).toBe('degraded');
    expect(healthStatus({ databaseOk: true, redisOk: true, queueRead: false, workers: null })).toBe(
      'degraded',
    );
  });

  it('is ok with the database up: embedded, or in queue mode with a worker', () => {
    expect(healthStatus({ databaseOk: true, redisOk: null, queueRead: true, workers: 1 })).toBe('ok');
    expect(healthStatus({ databaseOk: true, redisOk: true, queueRead: true, workers: 2 })).toBe('ok');
  });
});
