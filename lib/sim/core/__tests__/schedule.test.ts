// Schedule: forward pass with lags, the maximum of parallel paths against Clark (1961), the
// criticality index, risk delays and time-dependent costs.
import { describe, expect, it } from 'vitest';
import { spearmanToPearson } from '../correlation/rank-pearson';
import { simulateSync } from '../engine';
import { normalCdf, normalPdf } from '../math/normal';
import { allocateForwardPass, downstreamOf, forwardPass } from '../schedule/forward-pass';
import { scheduleDates } from '../schedule/dates';
import { buildNetwork } from '../schedule/network';
import { fixed, model, normal, uniform } from './helpers';

/** Clark (1961), Operations Research 9(2):145–162, eqs. (2)–(3): moments of max(X1, X2). */
function clark(m1: number, s1: number, m2: number, s2: number, rho: number) {
  const a = Math.sqrt(s1 * s1 + s2 * s2 - 2 * rho * s1 * s2);
  const alpha = (m1 - m2) / a;
  const mean = m1 * normalCdf(alpha) + m2 * normalCdf(-alpha) + a * normalPdf(alpha);
  const second =
    (m1 * m1 + s1 * s1) * normalCdf(alpha) +
    (m2 * m2 + s2 * s2) * normalCdf(-alpha) +
    (m1 + m2) * a * normalPdf(alpha);
  return { mean, variance: second - mean * mean, pFirst: normalCdf(alpha) };
}

describe('parallel paths', () => {
  const parallel = (rho?: number) =>
    model({
      activities: [
        { id: 'A1', duration: normal(100, 10) },
        { id: 'A2', duration: normal(105, 15) },
      ],
      correlations: rho === undefined ? [] : [{ a: 'A1', b: 'A2', rho }],
    });

  it.each([undefined, 0.5])('the project duration has the moments of Clark (1961) (rho %s)', (rho) => {
    const r = simulateSync(parallel(rho), { iterations: 60_000, seed: 12 });
    const ref = clark(100, 10, 105, 15, rho === undefined ? 0 : spearmanToPearson(rho));
    const d = r.duration!;
    expect(Math.abs(d.mean - ref.mean)).toBeLessThan(0.15);
    expect(Math.abs(d.sd ** 2 / ref.variance - 1)).toBeLessThan(0.03);
    // Criticality of A1 = P(X1 > X2) = Φ((μ1 − μ2)/a).
    expect(Math.abs(r.criticality.A1 - ref.pFirst)).toBeLessThan(0.01);
    expect(r.criticality.A1 + r.criticality.A2).toBeCloseTo(1, 12);
  });
});

describe('finish-to-start with lags', () => {
  it('adds durations and lags along the longest chain', () => {
    const r = simulateSync(
      model({
        activities: [
          { id: 'A1', duration: fixed(5) },
          { id: 'A2', duration: fixed(7), predecessors: [{ id: 'A1', lag: 3 }] },
          { id: 'A3', duration: fixed(4), predecessors: ['A1'] },
          { id: 'A4', duration: fixed(2), predecessors: ['A2', 'A3'] },
        ],
      }),
      { iterations: 200, seed: 1 },
    );
    // A1 0–5, A2 8–15, A3 5–9, A4 15–17.
    expect(r.duration!.base).toBe(17);
    expect(r.duration!.percentiles.P50).toBe(17);
    expect(r.criticality).toEqual({ A1: 1, A2: 1, A3: 0, A4: 1 });
  });

  it('cuts negative durations at zero, with a warning', () => {
    const r = simulateSync(model({ activities: [{ id: 'A1', duration: normal(1, 2) }] }), {
      iterations: 2000,
      seed: 1,
    });
    expect(r.duration!.min).toBe(0);
    expect(r.warnings.some((w) => w.startsWith('A1: its duration can be negative'))).toBe(true);
  });
});

describe('risk delays and time-dependent items', () => {
  const m = model({
    items: [{ id: 'C1', ratePerDay: 100, activity: 'A2' }],
    activities: [
      { id: 'A1', duration: fixed(10) },
      { id: 'A2', duration: fixed(20), predecessors: ['A1'] },
    ],
    risks: [{ id: 'R1', probability: 0.25, delay: fixed(6), activity: 'A2' }],
    targets: { cost: 2000, duration: 30 },
  });

  it('lengthens the activity by the delay when the risk occurs, and the time-dependent cost with it', () => {
    const r = simulateSync(m, { iterations: 4000, seed: 2 });
    expect(r.cost.base).toBe(2000);
    expect(r.duration!.base).toBe(30);
    expect(r.duration!.probabilityWithinTarget!.value).toBe(0.75); // LHS: exactly 25% of each block
    expect(r.duration!.percentiles.P80).toBe(36);
    expect(r.cost.percentiles.P80).toBe(2600);
    expect(r.joint!.probability).toBe(0.75);
  });

  it('costs rate × sampled duration for a distributed rate', () => {
    const r = simulateSync(
      model({
        items: [{ id: 'C1', ratePerDay: uniform(10, 20), activity: 'A1' }],
        activities: [{ id: 'A1', duration: uniform(100, 200) }],
      }),
      { iterations: 20_000, seed: 5 },
    );
    // Independent: E[rate × days] = 15 × 150; base = 15 × 150 (midpoints).
    expect(r.cost.base).toBe(2250);
    expect(Math.abs(r.cost.mean / 2250 - 1)).toBeLessThan(0.005);
    // Var(XY) = E[X²]E[Y²] − (E X E Y)² for independent X, Y.
    const ex2 = 15 ** 2 + 100 / 12;
    const ey2 = 150 ** 2 + 10000 / 12;
    expect(Math.abs(r.cost.sd ** 2 / (ex2 * ey2 - 2250 ** 2) - 1)).toBeLessThan(0.04);
  });
});

// Plumbing (the engine against itself): a second pass that recomputes only the activities whose
// durations changed and those after them gives what a full pass gives, to the bit.
describe('a pass over the changed activities only', () => {
  it.each([false, true])('matches a full pass (mixed link types: %s)', (mixed) => {
    const net = buildNetwork([
      { id: 'A', duration: fixed(1) },
      { id: 'B', duration: fixed(1), predecessors: ['A'] },
      { id: 'C', duration: fixed(1), predecessors: [mixed ? { id: 'A', type: 'SS', lag: 2 } : 'A'] },
      { id: 'D', duration: fixed(1), predecessors: ['B', 'C'] },
      { id: 'E', duration: fixed(1) },
    ]);
    const n = 7;
    const stride = 8;
    const durations = Float64Array.from({ length: 5 * stride }, (_, k) => 1 + ((k * 7919) % 13));
    const changedDurations = durations.slice();
    // C (index 2) longer and shorter in turn: D must follow, A, B and E keep their finish.
    for (let i = 0; i < n; i++) changedDurations[2 * stride + i] += i % 2 ? 9 : -0.5;
    const changed = downstreamOf(net, [2]);
    expect(Array.from(changed)).toEqual([0, 0, 1, 1, 0]);

    const full = allocateForwardPass(5, stride);
    const fullTotal = new Float64Array(n);
    const fullCritical = new Int32Array(5);
    forwardPass(net, changedDurations, n, full, fullTotal, fullCritical);

    const partial = allocateForwardPass(5, stride);
    const first = new Float64Array(n);
    forwardPass(net, durations, n, partial, first, null);
    const partialTotal = new Float64Array(n);
    const partialCritical = new Int32Array(5);
    forwardPass(net, changedDurations, n, partial, partialTotal, partialCritical, changed);

    expect(partialTotal).toEqual(fullTotal);
    expect(partialCritical).toEqual(fullCritical);
    expect(partialTotal).not.toEqual(first);
  });
});

// Which activities may be the last to finish, against early dates worked out by hand with the
// precedence diagramming method's rules (common practice: FS ES_b ≥ EF_a + lag, SS ES_b ≥ ES_a +
// lag, FF EF_b ≥ EF_a + lag, nothing starts before 0, T the latest early finish).
describe('activities that can finish last', () => {
  const activities = [
    { id: 'A', duration: fixed(3) },
    { id: 'B', duration: fixed(5), predecessors: ['A'] },
    { id: 'C', duration: fixed(10), predecessors: [{ id: 'B', lag: 2 }] },
    { id: 'D', duration: fixed(1), predecessors: [{ id: 'C', lag: -4 }] },
    { id: 'E', duration: fixed(2), predecessors: [{ id: 'D', type: 'SS' as const }] },
    { id: 'F', duration: fixed(1), predecessors: [{ id: 'E', type: 'FF' as const }] },
  ];

  it('leaves out an activity with a predecessor and a finish-to-start successor, lag ≥ 0', () => {
    // By hand: A 0–3, B 3–8, C 10–20 (FS+2), D 16–17 (FS−4: a lead), E 16–18 (SS), F 17–18 (FF).
    // B has a predecessor and an FS+2 successor (C finishes at 20 ≥ 8): 0. A has no predecessor,
    // C's successor is a lead (D finishes before C), D's successor is SS and E's is FF (the pass
    // reaches an FF bound through the start, so it is not counted on): 1. F has no successor: 1.
    expect(Array.from(buildNetwork(activities).canFinishLast)).toEqual([1, 0, 1, 1, 1, 1]);
    // T = 20, C's finish: C follows B and precedes D, and still finishes last.
    const dates = scheduleDates(activities, [3, 5, 10, 1, 2, 1]);
    expect(dates.duration).toBe(20);
    expect(dates.activities.F).toMatchObject({ earlyStart: 17, earlyFinish: 18 });
  });
});

// An activity with more predecessors than the passes fuse into one loop (four), against dates
// worked out by hand with the precedence diagramming method's rules (common practice).
describe('an activity with four predecessors', () => {
  it('starts after the latest of them and leaves the others their float', () => {
    const activities = [
      { id: 'A', duration: fixed(4) },
      { id: 'B', duration: fixed(6) },
      { id: 'C', duration: fixed(3), predecessors: ['A'] },
      { id: 'D', duration: fixed(2) },
      { id: 'E', duration: fixed(5), predecessors: ['A', { id: 'B', lag: 1 }, 'C', { id: 'D', lag: 2 }] },
    ];
    // By hand: A 0–4, B 0–6, C 4–7, D 0–2; ES_E = max(4, 6 + 1, 7, 2 + 2) = 7 (B and C tie),
    // EF_E = 12 = T. Backward: LS_E = 7, so LF_A ≤ 7 and LF_C ≤ 7, LF_B ≤ 6, LF_D ≤ 5; LF_A is
    // also ≤ LS_C = 4. Floats: A 0, B 0, C 0, D 3, E 0.
    const r = scheduleDates(activities, [4, 6, 3, 2, 5]);
    expect(r.duration).toBe(12);
    expect(r.activities.E).toMatchObject({ earlyStart: 7, earlyFinish: 12, lateFinish: 12 });
    const floats = Object.fromEntries(Object.entries(r.activities).map(([id, d]) => [id, d.totalFloat]));
    expect(floats).toEqual({ A: 0, B: 0, C: 0, D: 3, E: 0 });
    expect(r.activities.D.lateFinish).toBe(5);
  });
});
