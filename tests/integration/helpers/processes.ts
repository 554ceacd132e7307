// Child processes of the queue-mode tests: queue workers (`npm run worker`'s bundle) and extra
// `next start` instances on the slot's build, each with the test's Redis and queue prefix.
import { spawn, execFileSync, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';

export const REDIS_TEST_URL = process.env.REDIS_TEST_URL ?? 'redis://127.0.0.1:6400';

/** A queue prefix of its own, so that tests never see each other's jobs. */
export const freshPrefix = (label: string) => `outturn-test-${label}-${randomBytes(4).toString('hex')}`;

export type Child = {
  process: ChildProcess;
  output: () => string;
  /** Sends the signal and waits for the exit; the exit code (null when killed by a signal). */
  stop: (signal?: NodeJS.Signals) => Promise<number | null>;
};

function launch(command: string, args: string[], env: Record<string, string>): Child {
  const child = spawn(command, args, {
    env: { ...process.env, REDIS_URL: REDIS_TEST_URL, ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let text = '';
  child.stdout!.on('data', (d) => (text += d));
  child.stderr!.on('data', (d) => (text += d));
  const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
  return {
    process: child,
    output: () => text,
    async stop(signal = 'SIGTERM') {
      if (child.exitCode === null && child.signalCode === null) child.kill(signal);
      return exited;
    },
  };
}

async function until(what: string, ready: () => boolean | Promise<boolean>, child: Child, timeoutMs: number) {
  const end = Date.now() + timeoutMs;
  while (!(await ready())) {
    if (child.process.exitCode !== null) throw new Error(`${what} exited: ${child.output()}`);
    if (Date.now() > end) throw new Error(`${what} not ready after ${timeoutMs} ms: ${child.output()}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** Builds the worker's bundle from the current sources (as `npm run worker` does). */
export function buildWorkerBundle() {
  execFileSync('node', ['scripts/build-worker.mjs'], { stdio: 'ignore' });
}

/** Starts one queue worker and waits until it takes jobs. */
export async function startWorker(env: Record<string, string>): Promise<Child> {
  const worker = launch('node', ['.build/outturn-worker.mjs'], env);
  await until('worker', () => /ready/.test(worker.output()), worker, 60_000);
  return worker;
}

/** Starts `next start` on a port with the slot's build, and waits until it serves pages. */
export async function startWebInstance(port: number, env: Record<string, string>): Promise<Child> {
  const url = `http://localhost:${port}`;
  const web = launch('node_modules/.bin/next', ['start', '-p', String(port)], {
    NEXTAUTH_URL: url,
    APP_URL: url,
    ...env,
  });
  const serves = () =>
    fetch(`${url}/sign-in`).then(
      (r) => r.ok,
      () => false,
    );
  await until(`web instance on ${port}`, serves, web, 120_000);
  return web;
}
