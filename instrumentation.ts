// Runs once when the Next.js server starts: the background work of the server process, so
// that it happens wherever the app runs, without a separate worker to deploy. The mail
// sender delivers the outbox (lib/mail); interrupted simulation runs are recovered.
export async function register() {
  if (process.env.NEXT_RUNTIME === 'nodejs') {
    const { startMailSender } = await import('./lib/mail/sender');
    startMailSender();
    // Embedded, runs left 'running' by the previous process are marked failed; queued ones start
    // again (in queue mode their jobs are added again, and running runs are the workers').
    const { recoverInterruptedRuns, startRunSweeper } = await import('./lib/services/runs/recover');
    await recoverInterruptedRuns().catch((e) => console.error('Interrupted runs not recovered:', e));
    // A run whose final write was lost (a database outage) is ended with a reason later on.
    startRunSweeper();
  }
}
