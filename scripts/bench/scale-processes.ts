// The processes the scale benchmark starts (web instances, queue workers): each in its own
// process group, so that stopping it stops whatever it started (npm → bash → node), with its
// output in a log file; and what Linux says of a process (/proc): peak resident memory, CPU time.
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';

export type Started = {
  name: string;
  child: ChildProcess;
  log: string;
  exited: Promise<number | null>;
  /** Resolves once a line of its output matches, rejects if it exits first or time runs out. */
  waitFor(pattern: RegExp, timeoutMs: number): Promise<void>;
};

const everyStarted = new Set<Started>();

export function start(
  name: string,
  command: string,
  args: string[],
  env: Record<string, string>,
  log: string,
): Started {
  const out = fs.openSync(log, 'w');
  const child = spawn(command, args, {
    env: env as unknown as NodeJS.ProcessEnv,
    detached: true,
    stdio: ['ignore', out, out],
  });
  fs.closeSync(out);
  const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
  const started: Started = {
    name,
    child,
    log,
    exited,
    waitFor(pattern, timeoutMs) {
      const deadline = Date.now() + timeoutMs;
      let gone = false;
      exited.then(() => (gone = true));
      return new Promise((resolve, reject) => {
        const look = () => {
          if (pattern.test(fs.readFileSync(log, 'utf8'))) return resolve();
          if (gone) return reject(new Error(`${name} exited before it was ready; see ${log}:\n${tail(log)}`));
          if (Date.now() > deadline)
            return reject(new Error(`${name} not ready after ${timeoutMs / 1000} s; see ${log}`));
          setTimeout(look, 250);
        };
        look();
      });
    },
  };
  everyStarted.add(started);
  exited.then(() => everyStarted.delete(started));
  return started;
}

export function tail(log: string, lines = 15): string {
  try {
    return fs.readFileSync(log, 'utf8').trimEnd().split('\n').slice(-lines).join('\n');
  } catch {
    return '';
  }
}

/** SIGTERM to the process's group, SIGKILL after `graceMs` if it has not exited. */
export async function stop(p: Started, graceMs = 30_000): Promise<void> {
  if (p.child.exitCode !== null || p.child.signalCode !== null) return;
  const signal = (s: NodeJS.Signals) => {
    try {
      process.kill(-p.child.pid!, s);
    } catch {
      // Already gone.
    }
  };
  signal('SIGTERM');
  const killed = setTimeout(() => signal('SIGKILL'), graceMs);
  await p.exited;
  clearTimeout(killed);
  // Whatever the group left behind (a child that ignored the signal).
  signal('SIGKILL');
}

/** Stops at once every process this benchmark started and has not stopped (on exit or Ctrl-C). */
export function killAllNow(): void {
  for (const p of everyStarted) {
    try {
      process.kill(-p.child.pid!, 'SIGKILL');
    } catch {
      // Already gone.
    }
  }
}

/** The descendants of a process (children, their children…), from /proc. */
export function descendants(pid: number): number[] {
  const parentOf = new Map<number, number>();
  for (const entry of fs.readdirSync('/proc')) {
    if (!/^\d+$/.test(entry)) continue;
    try {
      const stat = fs.readFileSync(`/proc/${entry}/stat`, 'utf8');
      parentOf.set(Number(entry), Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[1]));
    } catch {
      // Exited while we looked.
    }
  }
  const out: number[] = [];
  const walk = (p: number) => {
    for (const [child, parent] of parentOf) {
      if (parent === p) {
        out.push(child);
        walk(child);
      }
    }
  };
  walk(pid);
  return out;
}

export function commandLine(pid: number): string {
  try {
    return fs.readFileSync(`/proc/${pid}/cmdline`, 'utf8').split('\0').join(' ').trim();
  } catch {
    return '';
  }
}

/** Peak resident set size (VmHWM) in bytes, or null once the process is gone. */
export function peakMemory(pid: number): number | null {
  try {
    const m = /VmHWM:\s+(\d+) kB/.exec(fs.readFileSync(`/proc/${pid}/status`, 'utf8'));
    return m ? Number(m[1]) * 1024 : null;
  } catch {
    return null;
  }
}

/** CPU time (user + system) of a process in milliseconds, from /proc/<pid>/stat (clock ticks of 10 ms). */
export function cpuTimeMs(pid: number): number {
  const stat = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
  const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
  return (Number(fields[11]) + Number(fields[12])) * 10;
}
