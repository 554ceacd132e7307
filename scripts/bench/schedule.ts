// npm run bench:schedule: the schedule passes alone (forward pass, then forward and backward
// with the criticality counts) on the benchmark's network of 200 activities, one block of 2,000
// iterations at a time, with finish-to-start links only (the benchmark model) and with the same
// network's links turned into a mix of FS, SS, FF and SF with leads and lags. CPU time of this
// process; BENCH_REPEAT rounds (default 5), fastest and median shown.
// BENCH_FORWARD_PASS=path measures another implementation of the same functions (e.g. an older one).

import { pathToFileURL } from 'node:url';
import path from 'node:path';
import { loadavg } from 'node:os';
import seedrandom from 'seedrandom';
import { allocateForwardPass, buildNetwork, forwardPass, type ModelActivity } from '../../lib/sim';
import { inventModel } from './model';

const BLOCK = 2000;
const BLOCKS = 50; // 100,000 iterations, as `npm run bench`
const REPEAT = Math.max(1, Number(process.env.BENCH_REPEAT ?? 5));

interface Passes {
  allocateForwardPass: typeof allocateForwardPass;
  forwardPass: typeof forwardPass;
}
const current: Passes = { allocateForwardPass, forwardPass };

function mixedLinks(activities: ModelActivity[]): ModelActivity[] {
  const rnd = seedrandom('links');
  const types = ['FS', 'SS', 'FF', 'SF'] as const;
  return activities.map((a) => ({
    ...a,
    predecessors: (a.predecessors ?? []).map((p) => ({
      id: typeof p === 'string' ? p : p.id,
      type: types[Math.floor(rnd() * 4)],
      lag: Math.round((rnd() - 0.3) * 6),
    })),
  }));
}

function measure(passes: Passes, activities: ModelActivity[], critical: boolean) {
  const net = buildNetwork(activities);
  const rnd = seedrandom('durations');
  const duration = new Float64Array(net.size * BLOCK).map(() => 5 + 40 * rnd());
  const buf = passes.allocateForwardPass(net.size, BLOCK);
  const total = new Float64Array(BLOCK);
  const counts = new Int32Array(net.size);
  const times: number[] = [];
  let check = 0;
  for (let r = 0; r < REPEAT; r++) {
    const cpu = process.cpuUsage();
    for (let b = 0; b < BLOCKS; b++) {
      passes.forwardPass(net, duration, BLOCK, buf, total, critical ? counts : null);
      check += total[b];
    }
    const c = process.cpuUsage(cpu);
    times.push((c.user + c.system) / 1000);
  }
  times.sort((x, y) => x - y);
  return { fastest: times[0], median: times[Math.floor(times.length / 2)], check };
}

async function main() {
  const alt = process.env.BENCH_FORWARD_PASS;
  const passes: Passes = alt ? await import(pathToFileURL(path.resolve(alt)).href) : current;
  const fs = inventModel().activities!;
  console.log(`forward pass: ${alt ?? 'lib/sim/core/schedule/forward-pass.ts'}`);
  console.log(
    `load average ${loadavg()
      .map((x) => x.toFixed(2))
      .join(', ')}; ${REPEAT} rounds of ${BLOCKS} blocks × ${BLOCK}`,
  );
  console.log('network (200 activities)        passes               fastest cpu ms   median cpu ms');
  const cases: [string, ModelActivity[]][] = [['finish-to-start only', fs]];
  if (!alt || process.env.BENCH_MIXED === '1') cases.push(['FS/SS/FF/SF, leads, lags', mixedLinks(fs)]);
  for (const [label, acts] of cases) {
    for (const critical of [false, true]) {
      const m = measure(passes, acts, critical);
      console.log(
        `${label.padEnd(32)} ${(critical ? 'forward + backward' : 'forward').padEnd(20)} ${m.fastest.toFixed(0).padStart(14)}   ${m.median.toFixed(0).padStart(13)}`,
      );
    }
  }
}

void main();
