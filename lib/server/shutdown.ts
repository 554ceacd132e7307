import 'server-only';
/**
 * Graceful shutdown of a server process on SIGTERM or SIGINT (a balancer draining it, an
 * orchestrator replacing it, Ctrl-C).
 *
 * `next start` (Next.js 16) handles the HTTP side itself: on either signal it closes its server
 * (no new connections, idle keep-alive ones closed), waits for the requests in flight, closes
 * its own caches and then calls process.exit(143 or 130). This module runs beside it, in two
 * phases:
 *   1. at once, the 'background' steps: stop taking new background work (the mail sender, the
 *      run sweeper) and let what is in hand finish;
 *   2. once Next.js is done with the requests in flight (its process.exit call is held back
 *      until then), the 'connections' steps: Redis and the database, which those requests
 *      may still have needed;
 * then exit 0. A step that hangs cannot keep the process up: after FORCE_EXIT_MS it exits 1.
 * With NEXT_MANUAL_SIG_HANDLE set Next.js leaves the signals alone and nobody closes the
 * HTTP server; the steps still run.
 */
import { componentLogger } from '@/lib/log';

export type ShutdownPhase = 'background' | 'connections';
type Step = { phase: ShutdownPhase; name: string; run: () => unknown };
type ShutdownState = { installed: boolean; started: boolean; steps: Step[] };

/** The whole shutdown's limit; the balancer's own drain timeout should be longer. */
export const FORCE_EXIT_MS = 10_000;
/** Each step's limit: one stuck close must not starve the others. */
const STEP_MS = 5_000;
/** The codes Next.js exits with after SIGTERM and SIGINT: a clean stop, so 0. */
const SIGNAL_EXITS = new Set([128, 130, 143]);

const shutdownLog = componentLogger('shutdown');

// One registry per process, whichever bundle loads this module.
const holder = globalThis as unknown as { outturnShutdown?: ShutdownState };
const state: ShutdownState = (holder.outturnShutdown ??= { installed: false, started: false, steps: [] });

/** Adds a step to run at shutdown, in its phase, after the steps added before it (one per name). */
export function onShutdown(phase: ShutdownPhase, name: string, run: () => unknown): void {
  state.steps = state.steps.filter((s) => s.name !== name);
  state.steps.push({ phase, name, run });
}

async function runPhase(phase: ShutdownPhase) {
  for (const step of state.steps.filter((s) => s.phase === phase)) {
    const started = performance.now();
    let timer: NodeJS.Timeout | undefined;
    try {
      const limit = new Promise<'timeout'>(
        (resolve) => (timer = setTimeout(() => resolve('timeout'), STEP_MS)),
      );
      const outcome = await Promise.race([Promise.resolve(step.run()).then(() => 'done' as const), limit]);
      const ms = Math.round(performance.now() - started);
      if (outcome === 'timeout')
        shutdownLog.warn({ step: step.name, ms }, 'shutdown step did not finish in time');
      else shutdownLog.info({ step: step.name, ms }, 'shutdown step done');
    } catch (error) {
      shutdownLog.error(
        { step: step.name, reason: error instanceof Error ? error.message : String(error) },
        'shutdown step failed',
      );
    } finally {
      clearTimeout(timer);
    }
  }
}

/** Resolves with Next.js's exit code once it has finished with the HTTP server. */
function holdNextExit(exit: typeof process.exit): Promise<number> {
  if (process.env.NEXT_MANUAL_SIG_HANDLE) return Promise.resolve(0);
  return new Promise((resolve) => {
    process.exit = ((code?: number | string | null) => {
      process.exit = exit;
      resolve(Number(code ?? 0));
    }) as typeof process.exit;
  });
}

async function shutDown(signal: NodeJS.Signals) {
  if (state.started) return;
  state.started = true;
  const exit = process.exit.bind(process);
  const force = setTimeout(() => {
    shutdownLog.error({ signal, limitMs: FORCE_EXIT_MS }, 'shutdown took too long: exiting now');
    exit(1);
  }, FORCE_EXIT_MS);
  const httpDone = holdNextExit(exit);
  shutdownLog.info({ signal }, 'shutting down: no new work, finishing what is in hand');
  await runPhase('background');
  const nextCode = await httpDone;
  await runPhase('connections');
  const code = SIGNAL_EXITS.has(nextCode) ? 0 : nextCode;
  shutdownLog.info({ signal, code }, 'shut down');
  clearTimeout(force);
  exit(code);
}

/** Listens for SIGTERM and SIGINT once per process (instrumentation.ts calls it at start). */
export function installShutdownHandlers(): void {
  if (state.installed) return;
  state.installed = true;
  process.once('SIGTERM', (signal) => void shutDown(signal));
  process.once('SIGINT', (signal) => void shutDown(signal));
}
