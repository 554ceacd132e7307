// The engine against an independent implementation written here: a plain, slow, obviously
// correct loop over iterations (one object per sample, Math-style draws from seedrandom), on
// random small version 2 models without correlations. The two runs use different random numbers,
// so they are compared within their Monte Carlo error: means by a two-sample z-bound, and the
// engine's P50/P80 by the share of the loop's iterations at or below them (binomial bound).
import seedrandom from 'seedrandom';
import { describe, expect, it } from 'vitest';
import { simulateSync } from '../engine';
import type { DistSpec, Model, ModelActivity, ModelDriver, ModelItem, ModelRisk } from '../formats';

type Rng = () => number;

/** Inverse distribution functions of the kinds the random models use (textbook formulas). */
function draw(d: DistSpec, u: number): number {
  switch (d.type) {
    case 'fixed':
      return d.value;
    case 'uniform':
      return d.low + (d.high - d.low) * u;
    case 'triangular': {
      const { low: a, mode: c, high: b } = d;
      const fc = (c - a) / (b - a);
      return u < fc ? a + Math.sqrt(u * (b - a) * (c - a)) : b - Math.sqrt((1 - u) * (b - a) * (b - c));
    }
    default:
      throw new Error(`not used here: ${d.type}`);
  }
}

function randomModel(rng: Rng): Model {
  const r = (a: number, b: number) => a + (b - a) * rng();
  const three = (m: number): DistSpec => {
    const k = rng();
    if (k < 0.2) return { type: 'fixed', value: Math.round(m) };
    if (k < 0.6) return { type: 'uniform', low: m * 0.8, high: m * r(1.1, 1.6) };
    return { type: 'triangular', low: m * 0.8, mode: m, high: m * r(1.2, 2) };
  };
  const nAct = 2 + Math.floor(rng() * 5);
  const activities: ModelActivity[] = Array.from({ length: nAct }, (_, i) => ({
    id: `A${i + 1}`,
    duration: three(r(5, 30)),
    predecessors: Array.from({ length: i }, (_, j) => j)
      .filter(() => rng() < 0.4)
      .map((j) => (rng() < 0.3 ? { id: `A${j + 1}`, lag: Math.round(r(-5, 5)) } : `A${j + 1}`)),
  }));
  const items: ModelItem[] = Array.from({ length: 2 + Math.floor(rng() * 4) }, (_, i) => ({
    id: `C${i + 1}`,
    dist: three(r(100, 1000)),
  }));
  items.push({ id: 'CR', ratePerDay: three(r(2, 10)), activity: `A${1 + Math.floor(rng() * nAct)}` });
  items.push({ id: 'CP', ratePerDay: r(1, 5), span: 'project' });
  const risks: ModelRisk[] = Array.from({ length: 1 + Math.floor(rng() * 3) }, (_, i) => {
    const sign = rng() < 0.3 ? -1 : 1;
    const risk: ModelRisk = {
      id: `R${i + 1}`,
      probability: Math.round(r(0.05, 0.9) * 100) / 100,
      cost: { type: 'uniform', low: sign * r(10, 50), high: sign * r(60, 200) },
      delay: { type: 'uniform', low: sign * r(1, 3), high: sign * r(4, 12) },
      activities: [`A${1 + Math.floor(rng() * nAct)}`],
    };
    if (sign < 0) {
      risk.cost = { type: 'uniform', low: -r(60, 200), high: -r(10, 50) };
      risk.delay = { type: 'uniform', low: -r(4, 12), high: -r(1, 3) };
    }
    if (i === 0) {
      risk.post = { probability: Math.round(risk.probability * 50) / 100 };
      risk.mitigationCost = 7;
    }
    return risk;
  });
  const drivers: ModelDriver[] = [
    {
      id: 'D1',
      probability: Math.round(r(0.2, 1) * 100) / 100,
      factor: { type: 'uniform', low: 0.9, high: r(1.1, 1.5) },
      applies: [items[0].id, 'CR', activities[0].id],
    },
  ];
  return { format: 'outturn-model', version: 2, items, activities, risks, drivers };
}

/** One iteration of the model, the plain way; post-mitigation figures (the headline). */
function slowIteration(m: Model, rng: Rng): { cost: number; duration: number } {
  const factor = new Map<string, number>();
  for (const d of m.drivers ?? []) {
    const occurs = rng() < (d.probability ?? 1);
    const f = occurs ? draw(d.factor, rng()) : 1;
    for (const t of d.applies) factor.set(t, (factor.get(t) ?? 1) * f);
  }
  const f = (id: string) => factor.get(id) ?? 1;
  const acts = m.activities ?? [];
  const dur = new Map(acts.map((a) => [a.id, Math.max(0, draw(a.duration, rng()) * f(a.id))]));
  let cost = 0;
  for (const c of m.items) if (c.dist) cost += draw(c.dist, rng()) * f(c.id);
  for (const r of m.risks ?? []) {
    const p = r.post?.probability ?? r.probability;
    const occurs = rng() < p;
    const size = rng();
    if (r.mitigationCost !== undefined) cost += r.mitigationCost as number;
    if (!occurs) continue;
    if (r.cost) cost += draw(r.cost, size);
    for (const a of r.activities ?? []) dur.set(a, dur.get(a)! + draw(r.delay!, size));
  }
  for (const [a, d] of dur) dur.set(a, Math.max(0, d));
  const finish = new Map<string, number>();
  for (const a of acts) {
    let start = 0;
    for (const p of a.predecessors ?? []) {
      const id = typeof p === 'string' ? p : p.id;
      const lag = typeof p === 'string' ? 0 : (p.lag ?? 0);
      start = Math.max(start, finish.get(id)! + lag);
    }
    finish.set(a.id, start + dur.get(a.id)!);
  }
  const project = Math.max(...finish.values());
  for (const c of m.items) {
    if (c.ratePerDay === undefined) continue;
    const rate = (typeof c.ratePerDay === 'number' ? c.ratePerDay : draw(c.ratePerDay, rng())) * f(c.id);
    cost += rate * (c.span === 'project' ? project : dur.get(c.activity!)!);
  }
  return { cost, duration: project };
}

const meanSd = (x: number[]) => {
  const mean = x.reduce((s, v) => s + v, 0) / x.length;
  const sd = Math.sqrt(x.reduce((s, v) => s + (v - mean) ** 2, 0) / (x.length - 1));
  return { mean, sd };
};

describe('the engine against a plain loop', () => {
  it.each([1, 2, 3, 4, 5])('agrees on random model %i', (k) => {
    const m = randomModel(seedrandom(`model-${k}`));
    const n = 20_000;
    const res = simulateSync(m, { iterations: n, seed: k, sampling: 'mc' });
    const rng = seedrandom(`loop-${k}`);
    const cost: number[] = [];
    const duration: number[] = [];
    for (let i = 0; i < n; i++) {
      const it = slowIteration(m, rng);
      cost.push(it.cost);
      duration.push(it.duration);
    }
    for (const [engine, loop] of [
      [res.cost, cost],
      [res.duration!, duration],
    ] as const) {
      const { mean, sd } = meanSd(loop);
      // Two independent means of n draws each: difference within 4.5 standard errors.
      expect(Math.abs(engine.mean - mean)).toBeLessThanOrEqual(
        4.5 * Math.sqrt((sd ** 2 + engine.sd ** 2) / n) + 1e-9,
      );
      for (const [key, p] of [
        ['P50', 0.5],
        ['P80', 0.8],
      ] as const) {
        // q is a p-quantile when P(X < q) ≤ p ≤ P(X ≤ q) (the definition; it allows atoms),
        // each share known to the binomial error of the two runs, √(2p(1−p)/n).
        const q = engine.percentiles[key];
        const atMost = loop.filter((v) => v <= q).length / n;
        const below = loop.filter((v) => v < q).length / n;
        const tolerance = 4.5 * Math.sqrt((2 * p * (1 - p)) / n);
        expect(atMost).toBeGreaterThanOrEqual(p - tolerance);
        expect(below).toBeLessThanOrEqual(p + tolerance);
      }
    }
  });
});
