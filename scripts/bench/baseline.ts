// The comparison point of the benchmark: the same model simulated the way most code would be
// written — one object per iteration, jstat's samplers for independent inputs and jstat's
// inverse distribution functions behind a Gaussian copula (one Cholesky factor of all the
// correlated inputs) for correlated ones, a forward pass over activity objects, and Spearman's
// coefficient by sorting every input. It computes the same outputs: percentiles, sensitivity of
// both totals and criticality.

import jStat from 'jstat';
import type { DistSpec, Model } from '../../lib/sim';

const Z90 = 1.2815515655446004;

function lognormalParams(d: Extract<DistSpec, { type: 'lognormal' }>): [number, number] {
  if ('p10' in d)
    return [(Math.log(d.p10) + Math.log(d.p90)) / 2, (Math.log(d.p90) - Math.log(d.p10)) / (2 * Z90)];
  const s2 = Math.log(1 + (d.sd * d.sd) / (d.mean * d.mean));
  return [Math.log(d.mean) - s2 / 2, Math.sqrt(s2)];
}

// P10–P90 ranges are widened by a fixed factor, as a quick implementation would do.
function bounds(d: { low: number; mode: number; high: number; range?: string }): [number, number, number] {
  if (d.range !== 'p10-p90') return [d.low, d.mode, d.high];
  return [d.mode - (d.mode - d.low) * 1.6, d.mode, d.high + (d.high - d.mode) * 1.6];
}

function sample(d: DistSpec): number {
  switch (d.type) {
    case 'fixed':
      return d.value;
    case 'uniform':
      return jStat.uniform.sample(d.low, d.high);
    case 'triangular': {
      const [a, c, b] = bounds(d);
      return jStat.triangular.sample(a, b, c);
    }
    case 'pert': {
      const [a, c, b] = bounds(d);
      const alpha = 1 + (4 * (c - a)) / (b - a);
      const beta = 1 + (4 * (b - c)) / (b - a);
      return a + (b - a) * jStat.beta.sample(alpha, beta);
    }
    case 'normal':
      return jStat.normal.sample(d.mean, d.sd);
    case 'lognormal':
      return jStat.lognormal.sample(...lognormalParams(d));
  }
}

function inverse(d: DistSpec, u: number): number {
  switch (d.type) {
    case 'fixed':
      return d.value;
    case 'uniform':
      return jStat.uniform.inv(u, d.low, d.high);
    case 'triangular': {
      const [a, c, b] = bounds(d);
      return jStat.triangular.inv(u, a, b, c);
    }
    case 'pert': {
      const [a, c, b] = bounds(d);
      const alpha = 1 + (4 * (c - a)) / (b - a);
      const beta = 1 + (4 * (b - c)) / (b - a);
      return a + (b - a) * jStat.beta.inv(u, alpha, beta);
    }
    case 'normal':
      return jStat.normal.inv(u, d.mean, d.sd);
    case 'lognormal':
      return jStat.lognormal.inv(u, ...lognormalParams(d));
  }
}

function cholesky(A: number[][]): number[][] {
  const n = A.length;
  for (let jitter = 0; ; jitter = jitter ? jitter * 2 : 1e-6) {
    const L = A.map(() => new Array(n).fill(0));
    let ok = true;
    for (let j = 0; j < n && ok; j++) {
      let d = A[j][j] + jitter;
      for (let k = 0; k < j; k++) d -= L[j][k] ** 2;
      if (d <= 0) ok = false;
      else {
        L[j][j] = Math.sqrt(d);
        for (let i = j + 1; i < n; i++) {
          let s = A[i][j];
          for (let k = 0; k < j; k++) s -= L[i][k] * L[j][k];
          L[i][j] = s / L[j][j];
        }
      }
    }
    if (ok) return L;
  }
}

function spearman(x: number[], y: number[]): number {
  const rank = (v: number[]) => {
    const order = v.map((value, index) => ({ value, index })).sort((a, b) => a.value - b.value);
    const r = new Array<number>(v.length);
    for (let i = 0; i < order.length;) {
      let j = i;
      while (j + 1 < order.length && order[j + 1].value === order[i].value) j++;
      for (let k = i; k <= j; k++) r[order[k].index] = (i + j) / 2 + 1;
      i = j + 1;
    }
    return r;
  };
  const rx = rank(x);
  const ry = rank(y);
  const n = x.length;
  const mx = rx.reduce((s, v) => s + v, 0) / n;
  const my = ry.reduce((s, v) => s + v, 0) / n;
  let sxy = 0;
  let sxx = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    sxy += (rx[i] - mx) * (ry[i] - my);
    sxx += (rx[i] - mx) ** 2;
    syy += (ry[i] - my) ** 2;
  }
  return sxx > 0 && syy > 0 ? sxy / Math.sqrt(sxx * syy) : 0;
}

interface Iteration {
  cost: number;
  postCost: number;
  duration: number;
  inputs: Record<string, number>;
  critical: string[];
}

export function runBaseline(model: Model, iterations: number) {
  const activities = model.activities ?? [];
  const risks = model.risks ?? [];
  const byId = new Map(activities.map((a) => [a.id, a]));
  // Topological order by repeated scanning.
  const order: string[] = [];
  const placed = new Set<string>();
  while (order.length < activities.length) {
    for (const a of activities) {
      const preds = (a.predecessors ?? []).map((p) => (typeof p === 'string' ? p : p.id));
      if (!placed.has(a.id) && preds.every((p) => placed.has(p))) {
        order.push(a.id);
        placed.add(a.id);
      }
    }
  }
  const correlated = [...new Set((model.correlations ?? []).flatMap((c) => [c.a, c.b]))];
  const matrix = correlated.map((a) =>
    correlated.map((b) => {
      if (a === b) return 1;
      const c = (model.correlations ?? []).find((x) => (x.a === a && x.b === b) || (x.a === b && x.b === a));
      return c ? c.rho : 0;
    }),
  );
  const L = cholesky(matrix);
  const distOf = (id: string): DistSpec | undefined => {
    const item = model.items.find((i) => i.id === id);
    if (item) return item.dist ?? (typeof item.ratePerDay === 'object' ? item.ratePerDay : undefined);
    const act = byId.get(id);
    if (act) return act.duration;
    return risks.find((r) => r.id === id)?.cost;
  };

  const runs: Iteration[] = [];
  for (let it = 0; it < iterations; it++) {
    const inputs: Record<string, number> = {};
    const z = correlated.map(() => jStat.normal.sample(0, 1));
    const zc = L.map((row) => row.reduce((s, l, k) => s + l * z[k], 0));
    correlated.forEach((id, k) => {
      const d = distOf(id);
      if (d) inputs[id] = inverse(d, jStat.normal.cdf(zc[k], 0, 1));
    });
    const factor: Record<string, number> = {};
    for (const d of model.drivers ?? []) {
      const f = Math.random() < (d.probability ?? 1) ? sample(d.factor) : 1;
      inputs[d.id] = f;
      for (const t of d.applies) factor[t] = (factor[t] ?? 1) * f;
    }
    const durations: Record<string, number> = {};
    for (const a of activities)
      durations[a.id] = Math.max(0, (inputs[a.id] ?? sample(a.duration)) * (factor[a.id] ?? 1));
    for (const a of activities) inputs[a.id] = durations[a.id];
    let cost = 0;
    let postCost = 0;
    for (const r of risks) {
      const occurs = Math.random() < r.probability;
      const c = occurs && r.cost ? (inputs[r.id] ?? sample(r.cost)) : 0;
      const d = occurs && r.delay ? Math.max(0, sample(r.delay)) : 0;
      cost += c;
      for (const a of r.activities ?? (r.activity ? [r.activity] : [])) durations[a] += d;
      inputs[r.id] = c;
      if (r.post) {
        const postOccurs = Math.random() < (r.post.probability ?? r.probability);
        postCost += (postOccurs && r.cost ? sample(r.post.cost ?? r.cost) : 0) - c;
      }
      if (typeof r.mitigationCost === 'number') postCost += r.mitigationCost;
    }
    const finish: Record<string, number> = {};
    const driver: Record<string, string | null> = {};
    for (const id of order) {
      const a = byId.get(id)!;
      let start = 0;
      driver[id] = null;
      for (const p of a.predecessors ?? []) {
        const pid = typeof p === 'string' ? p : p.id;
        const lag = typeof p === 'string' ? 0 : (p.lag ?? 0);
        if (finish[pid] + lag > start) {
          start = finish[pid] + lag;
          driver[id] = pid;
        }
      }
      finish[id] = start + durations[id];
    }
    let last = order[0];
    for (const id of order) if (finish[id] > finish[last]) last = id;
    const critical: string[] = [];
    for (let a: string | null = last; a; a = driver[a]) critical.push(a);
    for (const item of model.items) {
      let v: number;
      if (item.ratePerDay !== undefined) {
        const rate =
          typeof item.ratePerDay === 'number'
            ? item.ratePerDay
            : (inputs[item.id] ?? sample(item.ratePerDay));
        inputs[item.id] = rate;
        v =
          rate *
          (factor[item.id] ?? 1) *
          (item.span === 'project' ? finish[last] : durations[item.activity!]);
      } else {
        v = (inputs[item.id] ?? (item.dist ? sample(item.dist) : (item.base ?? 0))) * (factor[item.id] ?? 1);
        inputs[item.id] = v;
      }
      cost += v;
    }
    runs.push({
      cost,
      postCost: cost + postCost,
      duration: activities.length ? finish[last] : 0,
      inputs,
      critical,
    });
  }

  const costs = runs.map((r) => r.cost);
  const durs = runs.map((r) => r.duration);
  const pct = (xs: number[], p: number) => [...xs].sort((a, b) => a - b)[Math.ceil(p * xs.length) - 1];
  const ids = Object.keys(runs[0].inputs);
  const sensitivity = ids.map((id) => {
    const xs = runs.map((r) => r.inputs[id]);
    return { id, cost: spearman(xs, costs), duration: spearman(xs, durs) };
  });
  const criticality: Record<string, number> = {};
  for (const r of runs) for (const a of r.critical) criticality[a] = (criticality[a] ?? 0) + 1 / runs.length;
  return {
    P50: pct(costs, 0.5),
    P80: pct(costs, 0.8),
    P90: pct(costs, 0.9),
    postP80: pct(
      runs.map((r) => r.postCost),
      0.8,
    ),
    durationP80: pct(durs, 0.8),
    sensitivity,
    criticality,
  };
}
