// `npm run worker`: a queue worker process (queue mode, REDIS_URL set). Bundled into
// .build/outturn-worker.mjs by scripts/build-worker.mjs. Stops cleanly on SIGTERM or SIGINT: no
// new jobs, its runs go back to the queue, connections close, exit code 0.
import { redisUrl } from '@/lib/queue/redis';
import { startRunWorker, maxRunning, workerConcurrency } from '@/lib/queue/run-worker';

async function main() {
  if (!redisUrl()) {
    console.error(
      'REDIS_URL is not set: a worker takes runs from Redis. Set it, e.g. redis://127.0.0.1:6390.',
    );
    process.exit(2);
  }
  // One engine thread per run unless OUTTURN_RUN_THREADS says otherwise (see runner.ts).
  process.env.OUTTURN_PROCESS_ROLE = 'worker';
  const runWorker = await startRunWorker();
  console.log(
    `Worker ${process.pid} ready: ${workerConcurrency()} run(s) at once here, at most ${maxRunning()} across workers.`,
  );
  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`Worker ${process.pid}: ${signal}, handing back its runs and stopping.`);
    runWorker.close().then(
      () => process.exit(0),
      (e) => {
        console.error('Worker did not stop cleanly:', e);
        process.exit(1);
      },
    );
  };
  process.on('SIGTERM', () => stop('SIGTERM'));
  process.on('SIGINT', () => stop('SIGINT'));
}

main().catch((e) => {
  console.error('Worker did not start:', e);
  process.exit(1);
});
