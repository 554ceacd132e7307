// The bounded-memory run (../bounded): its P-values against a plain sort of the same iterations,
// its parts merged over a split against one part, and its other figures against the in-memory
// engine on the same iterations.
import { describe, expect, it } from 'vitest';
import {
  boundedChunks,
  combineFirstParts,
  FirstPartsGathering,
  finishBounded,
  firstPassPart,
  secondPassPart,
  secondPassRequest,
  simulateBounded,
} from '../bounded';
import { assertFinite } from '../bounded/finite';
import { prepareRun, simulateSync } from '../engine';
import { firstIterationBlocks } from '../first-iterations';
import type { Model, SimulationResult } from '../formats';
import { quantileIntervalRanks } from '../stats/order-statistics';
import { PERCENTILES } from '../stats/percentiles';

const model: Model = {
  format: 'outturn-model',
  version: 2,
  items: [
    { id: 'C1', dist: { type: 'normal', mean: 1000, sd: 120 } },
    { id: 'C2', dist: { type: 'triangular', low: 300, mode: 400, high: 900 } },
    { id: 'C3', dist: { type: 'uniform', low: 50, high: 250 } },
    { id: 'C4', ratePerDay: { type: 'uniform', low: 4, high: 6 }, activity: 'A2' },
  ],
  risks: [
    {
      id: 'R1',
      probability: 0.3,
      cost: { type: 'triangular', low: 100, mode: 200, high: 500 },
      delay: { type: 'triangular', low: 2, mode: 5, high: 12 },
      activity: 'A2',
      post: { probability: 0.15 },
    },
    { id: 'R2', probability: 0.5, cost: { type: 'uniform', low: 50, high: 150 }, items: ['C2'] },
  ],
  activities: [
    { id: 'A1', duration: { type: 'triangular', low: 8, mode: 10, high: 16 } },
    { id: 'A2', duration: { type: 'triangular', low: 15, mode: 20, high: 30 }, predecessors: ['A1'] },
    { id: 'A3', duration: { type: 'uniform', low: 20, high: 34 }, predecessors: ['A1'] },
  ],
  correlations: [{ a: 'C1', b: 'C3', rho: 0.6 }],
  targets: { cost: 2100, duration: 42 },
};

// Six blocks (the last of 500) in chunks of two blocks: three chunks.
const ITERATIONS = 10_500;
const CHUNK = 2;
const options = { iterations: ITERATIONS, seed: 11, sampling: 'lhs' as const };
const roundTrip = <T>(x: T): T => JSON.parse(JSON.stringify(x)) as T;

function boundedSplit(split: [number, number][], json: boolean): SimulationResult {
  const run = prepareRun(model, options);
  const pass = <T>(x: T) => (json ? roundTrip(x) : x);
  const first = split.map(([a, b]) => pass(firstPassPart(run, a, b, CHUNK)));
  const request = pass(secondPassRequest(run, first));
  const second = split.map(([a, b]) => pass(secondPassPart(run, request, a, b)));
  return finishBounded(run, first, request, second, { elapsedMs: 0, warnings: [] });
}

describe('bounded run', () => {
  const run = prepareRun(model, options);
  const bounded = boundedSplit([[0, boundedChunks(ITERATIONS, CHUNK)]], false);
  const memory = simulateSync(model, options);

  it('is split into the expected chunks', () => {
    expect(boundedChunks(ITERATIONS, CHUNK)).toBe(3);
    expect(boundedChunks(10_000_000)).toBe(79);
  });

  it('gives the P-values and intervals of a plain sort of the same iterations', () => {
    // Reference: the run's own iterations recomputed block by block, sorted with Array.sort;
    // P_p = x₍⌈np⌉₎ (Hyndman & Fan 1996, definition 1, as ../stats/order-statistics documents).
    const cost: number[] = [];
    const duration: number[] = [];
    for (const b of firstIterationBlocks(model, options, ITERATIONS)) {
      cost.push(...b.cost);
      duration.push(...b.duration!);
    }
    expect(cost.length).toBe(ITERATIONS);
    const n = ITERATIONS;
    for (const [values, summary] of [
      [cost, bounded.cost],
      [duration, bounded.duration!],
    ] as const) {
      const sorted = [...values].sort((a, b) => a - b);
      for (const [key, p] of PERCENTILES) {
        expect(summary.percentiles[key]).toBe(sorted[Math.ceil(n * p - 1e-9) - 1]);
        const [l, u] = quantileIntervalRanks(n, p);
        expect(summary.percentileCI95[key]).toEqual([sorted[l - 1], sorted[u - 1]]);
      }
      expect(summary.min).toBe(sorted[0]);
      expect(summary.max).toBe(sorted[n - 1]);
    }
  });

  it('gives the in-memory engine’s P-values, probabilities within target and joint counts exactly', () => {
    // Plumbing: both forms read the same iterations, so every order statistic and count agrees.
    for (const t of ['cost', 'duration'] as const) {
      expect(bounded[t]!.percentiles).toEqual(memory[t]!.percentiles);
      expect(bounded[t]!.percentileCI95).toEqual(memory[t]!.percentileCI95);
      expect(bounded[t]!.contingency).toEqual(memory[t]!.contingency);
      expect(bounded[t]!.probabilityWithinTarget).toEqual(memory[t]!.probabilityWithinTarget);
    }
    expect(bounded.joint!.probability).toBe(memory.joint!.probability);
    expect(bounded.joint!.atPLevels).toEqual(memory.joint!.atPLevels);
    for (const s of ['pre', 'post'] as const)
      for (const t of ['cost', 'duration'] as const)
        expect(bounded.mitigation![s][t]!.percentiles).toEqual(memory.mitigation![s][t]!.percentiles);
    expect(bounded.allocation!.iterations).toBe(memory.allocation!.iterations);
  });

  it('agrees with the in-memory engine on means, spreads, criticality and allocation', () => {
    // Plumbing: the same sums added in another order (per chunk): equal to rounding.
    for (const t of ['cost', 'duration'] as const) {
      expect(bounded[t]!.mean).toBeCloseTo(memory[t]!.mean, 8);
      expect(bounded[t]!.sd).toBeCloseTo(memory[t]!.sd, 8);
    }
    expect(bounded.criticality).toEqual(memory.criticality);
    for (const [id, v] of Object.entries(memory.allocation!.items))
      expect(bounded.allocation!.items[id]).toBeCloseTo(v, 8);
    for (const [id, v] of Object.entries(memory.allocation!.risks))
      expect(bounded.allocation!.risks[id]).toBeCloseTo(v, 8);
    expect(bounded.achievedCorrelations[0].achieved).toBeCloseTo(
      memory.achievedCorrelations[0].achieved!,
      10,
    );
  });

  it('ranks the tornado within 0.002 of the in-memory engine', () => {
    // Ranks grouped to buckets 2⁻¹⁶ of the value wide move Spearman's coefficient by far less
    // than its sampling error (≈ 1/√n ≈ 0.01 here); 0.002 is the stated tolerance.
    for (const t of ['cost', 'duration'] as const) {
      const byId = new Map(memory.sensitivity[t].map((e) => [e.id, e]));
      expect(bounded.sensitivity[t].map((e) => e.id).sort()).toEqual([...byId.keys()].sort());
      for (const e of bounded.sensitivity[t]) {
        const m = byId.get(e.id)!;
        expect(Math.abs(e.rankCorrelation - m.rankCorrelation)).toBeLessThan(0.002);
        expect(e.swing![0]).toBeCloseTo(m.swing![0], 8);
        expect(e.swing![1]).toBeCloseTo(m.swing![1], 8);
      }
    }
  });

  it('draws a frontier near the in-memory one and ends its convergence at the exact P-values', () => {
    // The frontier's costs are bucket middles (2⁻¹³ of the value) at durations within 2⁻¹⁶ of
    // the in-memory ones: 0.5% covers both and the step between neighbouring iterations.
    const mem = memory.joint!.frontier!.points;
    const bnd = bounded.joint!.frontier!.points;
    expect(bnd.length).toBe(mem.length);
    bnd.forEach((p, k) => {
      expect(p.duration).toBeGreaterThanOrEqual(mem[k].duration);
      expect((p.duration - mem[k].duration) / mem[k].duration).toBeLessThan(1e-4);
      // The first point sits where the contour is steepest (at the duration's P-value itself the
      // cost is the largest): a later duration only lowers it.
      if (k === 0) expect(p.cost).toBeLessThanOrEqual(mem[k].cost);
      else expect(Math.abs(p.cost - mem[k].cost) / mem[k].cost).toBeLessThan(0.005);
    });
    const { iterations, cost } = bounded.convergence;
    expect(iterations).toEqual([4000, 8000, ITERATIONS]);
    expect(cost.P80.at(-1)).toBe(memory.cost.percentiles.P80);
    expect(Math.abs(cost.P50[0] - memory.cost.percentiles.P50) / memory.cost.percentiles.P50).toBeLessThan(
      0.02,
    );
  });

  it('merges parts of a split, after a JSON round trip, to the one-part result bit for bit', () => {
    // Plumbing: the split must not change a single bit.
    const split = boundedSplit(
      [
        [0, 1],
        [1, 3],
      ],
      true,
    );
    expect(split).toEqual(bounded);
    expect(JSON.stringify(split)).toBe(JSON.stringify(bounded));
  });

  it('keeps parts plain and small', () => {
    const first = firstPassPart(run, 0, 3, CHUNK);
    expect(roundTrip(first)).toEqual(first);
    const request = secondPassRequest(run, [first]);
    const second = secondPassPart(run, request, 0, 3);
    expect(roundTrip(second)).toEqual(second);
    expect(JSON.stringify(second).length).toBeLessThan(200_000);
  });

  it('combines adjacent first parts, gathered in any order, into the one-part first pass', () => {
    // Plumbing: histograms and counts merge exactly, chunks stay in order.
    const gathering = new FirstPartsGathering();
    for (const c of [2, 0, 1]) gathering.add(firstPassPart(run, c, c + 1, CHUNK));
    expect(gathering.parts()).toEqual([firstPassPart(run, 0, 3, CHUNK)]);
    expect(() => combineFirstParts(firstPassPart(run, 0, 1, CHUNK), firstPassPart(run, 2, 3, CHUNK))).toThrow(
      /not adjacent/,
    );
  });

  it('refuses to put a number JSON cannot carry into a part', () => {
    // JSON turns NaN and ±Infinity into null: such a part would not come back as it went.
    expect(JSON.parse(JSON.stringify([NaN]))).toEqual([null]);
    expect(() => assertFinite('chunk 4', 1, [2, NaN])).toThrow(
      /chunk 4 holds a number that is not finite \(NaN\)/,
    );
    expect(() => assertFinite('chunk 4', null, Infinity)).toThrow(/Infinity/);
    expect(() => assertFinite('chunk 4', 1, [2, 3], null)).not.toThrow();
  });

  it('refuses parts that do not cover the run once', () => {
    const a = firstPassPart(run, 0, 1, CHUNK);
    const b = firstPassPart(run, 2, 3, CHUNK);
    expect(() => secondPassRequest(run, [a, b])).toThrow(/chunk 1 is missing/);
    expect(() => firstPassPart(run, 2, 4, CHUNK)).toThrow(/not a range/);
  });

  it('runs a cost-only model under Monte Carlo sampling to the in-memory P-values', () => {
    // Plumbing: no schedule, no second scenario, no targets; the same iterations either way.
    const costOnly: Model = { format: 'outturn-model', version: 2, items: model.items.slice(0, 3) };
    const o = { iterations: 7_001, seed: 3, sampling: 'mc' as const };
    const b = simulateBounded(costOnly, o, 1);
    const m = simulateSync(costOnly, o);
    expect(b.cost.percentiles).toEqual(m.cost.percentiles);
    expect(b.cost.percentileCI95).toEqual(m.cost.percentileCI95);
    expect(b.duration).toBeUndefined();
    expect(b.joint).toBeUndefined();
    expect(b.mitigation).toBeUndefined();
    expect(b.allocation!.iterations).toBe(m.allocation!.iterations);
    expect(b.convergence.iterations).toEqual([2000, 4000, 6000, 7001]);
  });

  it('runs in one call as simulateBounded', () => {
    expect(simulateBounded(model, options, CHUNK).cost.percentiles).toEqual(bounded.cost.percentiles);
  });
});
