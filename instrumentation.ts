// Runs once when the Next.js server starts: the background work of the server process, so
// that it happens wherever the app runs, without a separate worker to deploy. The mail
// sender delivers the outbox (lib/mail); interrupted simulation runs are recovered; SIGTERM
// and SIGINT stop it all gracefully (lib/server/shutdown.ts).
export async function register() {
  if (process.env.NEXT_RUNTIME === 'nodejs') {
    const { installShutdownHandlers, onShutdown } = await import('./lib/server/shutdown');
    const { componentLogger } = await import('./lib/log');
    const { logUnexpected } = await import('./lib/http/log-error');
    const { startMailSender, stopMailSender } = await import('./lib/mail/sender');
    startMailSender();
    onShutdown('background', 'mail sender', () => stopMailSender());
    // Embedded, runs left 'running' by the previous process are marked failed; queued ones start
    // again (in queue mode their jobs are added again, and running runs are the workers').
    const { recoverInterruptedRuns, startRunSweeper } = await import('./lib/services/runs/recover');
    await recoverInterruptedRuns().catch((e) =>
      logUnexpected(componentLogger('runs'), 'Interrupted runs not recovered', e),
    );
    // A run whose final write was lost (a database outage) is ended with a reason later on.
    startRunSweeper();
    // The sweeper keeps its timer there (lib/services/runs/recover.ts).
    const sweeper = globalThis as unknown as { outturnRunSweeper?: NodeJS.Timeout };
    onShutdown('background', 'run sweeper', () => clearInterval(sweeper.outturnRunSweeper));
    // Queue mode: the rate limits' connection opens now, so that the first sign-ins after a
    // start count in Redis rather than in this process's memory (lib/limits/rate-limiter.ts).
    const { limitsStore } = await import('./lib/limits/rate-limiter');
    limitsStore();
    const { closeRedisConnections } = await import('./lib/queue/redis');
    const { sequelize } = await import('./lib/db/sequelize');
    onShutdown('connections', 'redis', () => closeRedisConnections());
    onShutdown('connections', 'database', () => sequelize.close());
    installShutdownHandlers();
  }
}
