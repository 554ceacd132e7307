// A second app server beside the one the test run started: the same build (NEXT_DIST_DIR) and
// test database, its own port and environment (queue mode, say). Its stdout is kept, one
// parsed JSON log line per entry, so that a test can read what the server logged.
import { spawn, type ChildProcess } from 'node:child_process';

export type LogLine = Record<string, unknown> & { msg?: string; level?: string };

export type AppInstance = {
  url: string;
  /** Every JSON line the server has written to stdout so far. */
  lines: () => LogLine[];
  /** Sends the signal and waits for the exit: its code and how long it took. */
  stop: (signal?: NodeJS.Signals) => Promise<{ code: number | null; ms: number }>;
};

/** The slot's app port plus `offset`: the slot's ports are 3100 + 10·slot … + 9. */
export function sparePort(offset: number): number {
  const base = Number(new URL(process.env.APP_URL ?? 'http://localhost:3100').port);
  return base + offset;
}

export async function startAppInstance(port: number, env: Record<string, string>): Promise<AppInstance> {
  const child: ChildProcess = spawn('node_modules/.bin/next', ['start', '-p', String(port)], {
    env: { ...process.env, NEXT_TELEMETRY_DISABLED: '1', PORT: String(port), ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const parsed: LogLine[] = [];
  const raw: string[] = [];
  let pending = '';
  child.stdout!.on('data', (chunk: Buffer) => {
    pending += chunk.toString('utf8');
    const complete = pending.split('\n');
    pending = complete.pop()!;
    for (const line of complete) {
      raw.push(line);
      if (!line.startsWith('{')) continue;
      try {
        parsed.push(JSON.parse(line) as LogLine);
      } catch {
        // Next.js's own banner lines are not JSON.
      }
    }
  });
  child.stderr!.on('data', (chunk: Buffer) => raw.push(chunk.toString('utf8')));
  const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
  const url = `http://localhost:${port}`;
  for (let i = 0; i < 300; i++) {
    if (child.exitCode !== null) break;
    const up = await fetch(`${url}/sign-in`).then(
      (r) => r.ok,
      () => false,
    );
    if (up) {
      return {
        url,
        lines: () => parsed,
        stop: async (signal = 'SIGTERM') => {
          const started = Date.now();
          child.kill(signal);
          const code = await exited;
          return { code, ms: Date.now() - started };
        },
      };
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  child.kill('SIGKILL');
  throw new Error(`The second app server on port ${port} did not start:\n${raw.join('\n').slice(-3000)}`);
}

/** Waits until a log line matches (the logger writes asynchronously to the pipe). */
export async function waitForLine(instance: AppInstance, match: (line: LogLine) => boolean, ms = 5_000) {
  const until = Date.now() + ms;
  for (;;) {
    const found = instance.lines().find(match);
    if (found) return found;
    if (Date.now() > until) return undefined;
    await new Promise((r) => setTimeout(r, 50));
  }
}
