// An invented model of benchmark size, generated reproducibly from a seed: 500 line items of
// mixed distributions (some time-dependent), 50 risk events, 200 activities in a layered network
// and 100 correlations in small clusters; and the version 2 extensions: 20 risk drivers over
// items and activities, 10 risks on several activities with post-mitigation values and a
// response cost, 3 costs that run with the project's duration.

import seedrandom from 'seedrandom';
import type {
  DistSpec,
  Model,
  ModelActivity,
  ModelCorrelation,
  ModelDriver,
  ModelItem,
  ModelRisk,
} from '../../lib/sim';

export interface BenchSize {
  items: number;
  timeDependent: number;
  risks: number;
  activities: number;
  correlations: number;
  /** Version 2 extensions: drivers, risks on several activities with post-mitigation values, project-span costs. */
  drivers: number;
  multiActivityRisks: number;
  projectSpan: number;
}

export const BENCH_SIZE: BenchSize = {
  items: 500,
  timeDependent: 50,
  risks: 50,
  activities: 200,
  correlations: 100,
  drivers: 20,
  multiActivityRisks: 10,
  projectSpan: 3,
};

export function inventModel(size: BenchSize = BENCH_SIZE, seed = 'bench'): Model {
  const rnd = seedrandom(seed);
  const pick = <T>(xs: T[]) => xs[Math.floor(rnd() * xs.length)];
  const round = (x: number) => Math.round(x);
  const threePoint = (m: number, type: 'triangular' | 'pert', p10p90 = false): DistSpec => ({
    type,
    low: round(m * (0.75 + 0.15 * rnd())),
    mode: round(m),
    high: round(m * (1.15 + 0.6 * rnd())),
    ...(p10p90 ? { range: 'p10-p90' as const } : {}),
  });
  const amountDist = (m: number): DistSpec => {
    const r = rnd();
    if (r < 0.3) return threePoint(m, 'triangular', rnd() < 0.2);
    if (r < 0.6) return threePoint(m, 'pert', rnd() < 0.2);
    if (r < 0.7) return { type: 'uniform', low: round(m * 0.85), high: round(m * 1.25) };
    if (r < 0.8) return { type: 'normal', mean: round(m), sd: round(m * 0.08) };
    if (r < 0.87) return { type: 'lognormal', p10: round(m * 0.85), p90: round(m * 1.4) };
    if (r < 0.94) return { type: 'lognormal', mean: round(m * 1.05), sd: round(m * 0.15) };
    return { type: 'fixed', value: round(m) };
  };

  const activities: ModelActivity[] = [];
  for (let i = 0; i < size.activities; i++) {
    const layer = Math.floor(i / 10);
    const predecessors: ModelActivity['predecessors'] = [];
    if (layer > 0) {
      const count = 1 + Math.floor(rnd() * 3);
      const seen = new Set<number>();
      for (let k = 0; k < count; k++) {
        const p = (layer - 1 - Math.floor(rnd() * Math.min(layer, 2))) * 10 + Math.floor(rnd() * 10);
        if (seen.has(p)) continue;
        seen.add(p);
        predecessors.push(rnd() < 0.2 ? { id: `A${p + 1}`, lag: Math.floor(rnd() * 5) } : `A${p + 1}`);
      }
    }
    const m = 5 + rnd() * 40;
    activities.push({
      id: `A${i + 1}`,
      name: `Activity ${i + 1}`,
      duration: pick([threePoint(m, 'pert'), threePoint(m, 'triangular')]),
      predecessors,
    });
  }

  const items: ModelItem[] = [];
  for (let i = 0; i < size.items; i++) {
    const id = `C${i + 1}`;
    if (
      i % Math.floor(size.items / size.timeDependent) === 0 &&
      items.filter((x) => x.ratePerDay).length < size.timeDependent
    ) {
      const rate = 500 + rnd() * 5000;
      items.push({
        id,
        name: `Time-related cost ${i + 1}`,
        ratePerDay: amountDist(rate),
        activity: pick(activities).id,
      });
    } else {
      items.push({ id, name: `Line item ${i + 1}`, dist: amountDist(10_000 + rnd() * 400_000) });
    }
  }

  const risks: ModelRisk[] = [];
  for (let i = 0; i < size.risks; i++) {
    const m = 20_000 + rnd() * 800_000;
    const risk: ModelRisk = {
      id: `R${i + 1}`,
      name: `Risk ${i + 1}`,
      probability: +(0.05 + 0.5 * rnd()).toFixed(2),
      cost: threePoint(m, pick(['triangular', 'pert'] as const)),
    };
    if (i % 3 === 0) {
      risk.delay = threePoint(3 + rnd() * 20, 'triangular');
      risk.activity = pick(activities).id;
    }
    risks.push(risk);
  }

  // Clusters of 5 inputs of one kind, each cluster a chain plus a chord: 4–5 pairs per cluster.
  const correlations: ModelCorrelation[] = [];
  const stochasticItems = items.filter((x) => x.dist && x.dist.type !== 'fixed').map((x) => x.id);
  const pools = [
    { ids: stochasticItems, share: 0.7 },
    { ids: activities.map((a) => a.id), share: 0.2 },
    { ids: risks.map((r) => r.id), share: 0.1 },
  ];
  for (const { ids, share } of pools) {
    const want = Math.round(size.correlations * share);
    let made = 0;
    for (let c = 0; made < want; c++) {
      const members = ids.slice(c * 5, c * 5 + 5);
      if (members.length < 2) break;
      for (let k = 1; k < members.length && made < want; k++, made++) {
        correlations.push({ a: members[k - 1], b: members[k], rho: +(0.2 + 0.6 * rnd()).toFixed(2) });
      }
    }
  }

  // Version 2: risks on several activities with post-mitigation values and a response cost.
  for (let i = 0; i < size.multiActivityRisks; i++) {
    const m = 50_000 + rnd() * 500_000;
    const acts = [...new Set(Array.from({ length: 2 + Math.floor(rnd() * 3) }, () => pick(activities).id))];
    const probability = +(0.1 + 0.5 * rnd()).toFixed(2);
    risks.push({
      id: `RM${i + 1}`,
      name: `Risk on several activities ${i + 1}`,
      probability,
      cost: threePoint(m, 'triangular'),
      delay: threePoint(2 + rnd() * 10, 'pert'),
      activities: acts,
      post: { probability: +(probability / 2).toFixed(2), cost: threePoint(m * 0.6, 'triangular') },
      mitigationCost: Math.round(m * 0.05),
    });
  }
  for (let i = 0; i < size.projectSpan; i++) {
    items.push({
      id: `CP${i + 1}`,
      name: `Project overheads ${i + 1}`,
      ratePerDay: amountDist(2000 + rnd() * 8000),
      span: 'project',
    });
  }
  const drivers: ModelDriver[] = [];
  for (let i = 0; i < size.drivers; i++) {
    const applies = new Set<string>();
    for (let k = 0; k < 15; k++) applies.add(pick(items).id);
    for (let k = 0; k < 5; k++) applies.add(pick(activities).id);
    drivers.push({
      id: `D${i + 1}`,
      name: `Driver ${i + 1}`,
      probability: +(0.3 + 0.7 * rnd()).toFixed(2),
      factor: { type: 'triangular', low: 0.9, mode: 1, high: +(1.1 + 0.3 * rnd()).toFixed(2) },
      applies: [...applies],
    });
  }

  const base = items.reduce((s, x) => s + (x.dist && 'mode' in x.dist ? x.dist.mode : 200_000), 0);
  return {
    format: 'outturn-model',
    version: 2,
    name: 'Invented benchmark project',
    currency: 'EUR',
    items,
    risks,
    activities,
    correlations,
    drivers,
    targets: { cost: Math.round(base * 1.15), duration: 400 },
    settings: { iterations: 100_000, seed: 42, sampling: 'lhs' },
  };
}
