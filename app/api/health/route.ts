// GET /api/health → { status, mode, database, redis, queue, workers }
// Public, for load balancers: 200 while this instance can serve (ok or degraded), 503 when
// the database (or, in queue mode, Redis) does not answer. No session, nothing secret, nothing
// of any organisation; logged at debug level when healthy, so probes do not flood the log.
import { NextResponse } from 'next/server';
import { handle } from '@/lib/http/route';
import { currentHealth } from '@/lib/services/health';

export const dynamic = 'force-dynamic';

export const GET = handle(
  async () => {
    const health = await currentHealth();
    return NextResponse.json(health, {
      status: health.status === 'down' ? 503 : 200,
      headers: { 'cache-control': 'no-store' },
    });
  },
  { quiet: true },
);
