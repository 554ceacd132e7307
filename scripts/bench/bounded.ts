// npm run bench:bounded: one bounded-memory run (lib/sim/core/bounded) of 10,000,000 iterations
// of the demo water-treatment project (its registers from the seeders, exported to a model file
// as a run does, post-mitigation values; without the drivers register) on 1 thread, in its own
// child process so that its peak memory is its own. Prints the wall time, the CPU time (user +
// system), the peak resident memory (VmHWM of /proc/self/status, and the process's maxRSS), the
// P50 and P80 of cost and duration, and the load average before and after: on a shared machine
// the wall time says more about the load than about the engine.
//
// Target: peak memory ≤ 512 MiB. BENCH_BOUNDED_ITERATIONS changes the iterations (e.g. 1000000
// for a quick look); BENCH_BOUNDED_MODEL=bench takes the engine benchmark's invented model
// (./model) instead of the demo project.

import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { loadavg } from 'node:os';
import { fileURLToPath } from 'node:url';
import type { DistSpec, Model } from '../../lib/sim';
import { runSimulation } from '../../lib/sim/runtime';
import { registersToModel, type RegisterRecords } from '../../lib/domain/model-export';
import { inventModel } from './model';

const ITERATIONS = Number(process.env.BENCH_BOUNDED_ITERATIONS ?? 10_000_000);
const TARGET_MIB = 512;

interface Measurement {
  model: string;
  iterations: number;
  wallMs: number;
  cpuMs: number;
  hwmMiB: number;
  maxRssMiB: number;
  cost: { P50: number; P80: number };
  duration?: { P50: number; P80: number };
}

/** The seeders' register rows, in the shape the seeder writes them (links by code). */
interface SeedRegisters {
  code: string;
  items: {
    code: string;
    description: string;
    base: number | null;
    dist: DistSpec | null;
    ratePerDay: DistSpec | null;
    activity: string | null;
  }[];
  risks: {
    code: string;
    title: string;
    status: string;
    probability: number;
    costImpact: DistSpec | null;
    delayImpact: DistSpec | null;
    activity: string | null;
    postProbability: number | null;
    mitigationCost: number | null;
  }[];
  activities: RegisterRecords['activities'];
  correlations: RegisterRecords['correlations'];
}

/** The demo project's registers as the app reads them, exported to a model as a run does. */
function demoModel(): { name: string; model: Model } {
  const require = createRequire(import.meta.url);
  const { DEMO_REGISTERS } = require('../../seeders/data/demo-registers.cjs') as {
    DEMO_REGISTERS: SeedRegisters[];
  };
  const wtp = DEMO_REGISTERS[0];
  const records: RegisterRecords = {
    project: { name: `Demo project ${wtp.code}`, currency: 'EUR' },
    items: wtp.items.map((i) => ({ ...i, activityCode: i.activity })),
    risks: wtp.risks.map((r) => ({
      ...r,
      postCostImpact: null,
      postDelayImpact: null,
      activityCodes: r.activity ? [r.activity] : [],
    })),
    activities: wtp.activities,
    correlations: wtp.correlations,
  };
  return { name: `demo project ${wtp.code}`, model: registersToModel(records, { riskValues: 'post' }).model };
}

/** Peak resident memory from the kernel's high-water mark, in MiB. */
function vmHwmMiB(): number {
  const m = /VmHWM:\s+(\d+) kB/.exec(readFileSync('/proc/self/status', 'utf8'));
  return m ? Number(m[1]) / 1024 : NaN;
}

async function child(): Promise<Measurement> {
  const { name, model } =
    process.env.BENCH_BOUNDED_MODEL === 'bench'
      ? { name: 'engine benchmark model', model: inventModel() }
      : demoModel();
  const cpu = process.cpuUsage();
  const started = performance.now();
  let shown = 0;
  const r = await runSimulation(model, {
    iterations: ITERATIONS,
    seed: 42,
    sampling: 'lhs',
    threads: 1,
    bounded: true,
    onProgress: ({ done, total }) => {
      const tenth = Math.floor((10 * done) / total);
      if (tenth > shown) {
        shown = tenth;
        process.stderr.write(`${tenth * 10}% (${Math.round((performance.now() - started) / 1000)} s)\n`);
      }
    },
  });
  const wallMs = performance.now() - started;
  const c = process.cpuUsage(cpu);
  const pick = (t: { percentiles: { P50: number; P80: number } }) => ({
    P50: t.percentiles.P50,
    P80: t.percentiles.P80,
  });
  return {
    model: name,
    iterations: r.iterations,
    wallMs,
    cpuMs: (c.user + c.system) / 1000,
    hwmMiB: vmHwmMiB(),
    maxRssMiB: process.resourceUsage().maxRSS / 1024,
    cost: pick(r.cost),
    ...(r.duration ? { duration: pick(r.duration) } : {}),
  };
}

const fmt = (x: number, d = 0) =>
  x.toLocaleString('en-US', { maximumFractionDigits: d, minimumFractionDigits: d });

async function main() {
  if (process.argv.includes('--child')) {
    process.stdout.write(`${JSON.stringify(await child())}\n`);
    return;
  }
  const before = loadavg();
  const self = fileURLToPath(import.meta.url);
  const out = spawnSync(process.execPath, [...process.execArgv, self, '--child'], {
    encoding: 'utf8',
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  if (out.status !== 0) throw new Error('the bounded run failed');
  const after = loadavg();
  const m = JSON.parse(out.stdout.trim().split('\n').pop()!) as Measurement;
  const peak = Math.max(m.hwmMiB, m.maxRssMiB);
  console.log(`bounded run: ${m.model}, ${fmt(m.iterations)} iterations, LHS, seed 42, 1 thread`);
  console.log(`  wall ${fmt(m.wallMs / 1000, 1)} s, CPU ${fmt(m.cpuMs / 1000, 1)} s`);
  console.log(`  peak resident memory ${fmt(m.hwmMiB, 1)} MiB (VmHWM), ${fmt(m.maxRssMiB, 1)} MiB (maxRSS)`);
  console.log(`  cost P50 ${fmt(m.cost.P50)}, P80 ${fmt(m.cost.P80)}`);
  if (m.duration) console.log(`  duration P50 ${fmt(m.duration.P50, 2)}, P80 ${fmt(m.duration.P80, 2)} days`);
  console.log(
    `  load average before ${before.map((x) => fmt(x, 1)).join(' ')}, after ${after.map((x) => fmt(x, 1)).join(' ')}`,
  );
  console.log(`  target peak ≤ ${TARGET_MIB} MiB: ${peak <= TARGET_MIB ? 'met' : 'MISSED'}`);
}

main().catch((e: unknown) => {
  console.error(e);
  process.exit(1);
});
