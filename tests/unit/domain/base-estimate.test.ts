import { describe, expect, it } from 'vitest';
import { baseDuration, baseEstimate, baseOf, itemBase } from '@/lib/domain/base-estimate';
import { activityBaseDurations, lineBase, projectBaseDuration } from '@/lib/registers/base-estimate';
import { createDistribution, simulateSync, type Model } from '@/lib/sim';

describe('the base of a distribution', () => {
  it('is the mode of a triangular and of a PERT, not their mean', () => {
    // The base of a three-point estimate is its most likely value, the mode c (definition of
    // the triangular distribution's parameters; Kotz & van Dorp 2004, ch. 1).
    expect(baseOf({ type: 'triangular', low: 100, mode: 120, high: 200 })).toBe(120);
    expect(baseOf({ type: 'pert', low: 100, mode: 120, high: 200 })).toBe(120);
    // …whereas the PERT mean is (a + 4m + b) / 6 = (100 + 480 + 200) / 6 = 130 (Malcolm,
    // Roseboom, Clark & Fazar 1959): the base is not the mean.
    expect(
      createDistribution({ type: 'pert', low: 100, mode: 120, high: 200 }, { where: '', field: '' }).mean,
    ).toBeCloseTo(130, 10);
  });

  it('is the mode of a three-point estimate given as P10/P90 too', () => {
    // The most likely value keeps its meaning whatever the low and high stand for (definition).
    expect(baseOf({ type: 'triangular', low: 90, mode: 100, high: 130, range: 'p10-p90' })).toBe(100);
  });

  it('is the midpoint of a uniform, the mean of a normal and the value of a fixed', () => {
    // Uniform on [a, b]: mean = median = (a + b) / 2 (definition of the uniform distribution).
    expect(baseOf({ type: 'uniform', low: 10, high: 30 })).toBe(20);
    // Normal: mean = median = mode = μ (definition of the normal distribution).
    expect(baseOf({ type: 'normal', mean: 50, sd: 8 })).toBe(50);
    expect(baseOf({ type: 'fixed', value: 7 })).toBe(7);
  });

  it('is the median of a lognormal', () => {
    // ln X is normal, so the median is exp(median of ln X) = exp((ln P10 + ln P90) / 2) = √(P10·P90)
    // since z₀.₁ = −z₀.₉ (Johnson, Kotz & Balakrishnan 1994, ch. 14): √(80·180) = 120.
    expect(baseOf({ type: 'lognormal', p10: 80, p90: 180 })).toBeCloseTo(120, 8);
    // From mean m and sd s: median = m / √(1 + s²/m²) (same reference): 100 / √1.25.
    expect(baseOf({ type: 'lognormal', mean: 100, sd: 50 })).toBeCloseTo(100 / Math.sqrt(1.25), 8);
  });
});

describe('the base estimate', () => {
  const model: Model = {
    format: 'outturn-model',
    version: 1,
    items: [
      { id: 'C1', dist: { type: 'triangular', low: 100, mode: 150, high: 300 } },
      { id: 'C2', base: 500, dist: { type: 'pert', low: 400, mode: 450, high: 700 } },
      { id: 'C3', ratePerDay: { type: 'uniform', low: 8, high: 12 }, activity: 'A1' },
      { id: 'C4', ratePerDay: 5, activity: 'A2' },
    ],
    risks: [{ id: 'R1', probability: 0.5, cost: { type: 'fixed', value: 1000 } }],
    activities: [
      { id: 'A1', duration: { type: 'triangular', low: 20, mode: 30, high: 50 } },
      // A base duration below 0 days: the engine counts it as 0.
      { id: 'A2', duration: { type: 'triangular', low: -10, mode: -4, high: 20 }, predecessors: ['A1'] },
    ],
  };

  it('floors a base duration at 0 days', () => {
    expect(baseDuration({ type: 'triangular', low: -10, mode: -4, high: 20 })).toBe(0);
    expect(baseDuration({ type: 'fixed', value: 12 })).toBe(12);
  });

  it('adds line bases: the given base first, else the distribution, else rate × base duration', () => {
    // 150 (mode) + 500 (given) + 10 (uniform midpoint) × 30 (mode) + 5 × 0 (floored) = 950;
    // the risk event is not in the base (arithmetic of the rule in the header).
    expect(baseEstimate(model)).toBe(950);
    expect(itemBase({ ratePerDay: 5, activity: 'A9' }, new Map())).toBeNull();
    expect(itemBase({}, new Map())).toBe(0);
  });

  it('is the base the engine computes for the run', () => {
    expect(baseEstimate(model)).toBe(simulateSync(model, { iterations: 1000, seed: 1 }).cost.base);
  });

  it('gives the grid rows the same base, a negative duration floored as in the engine', () => {
    const durations = activityBaseDurations([
      { code: 'A1', distType: 'triangular', low: 20, mode: 30, high: 50 },
      { code: 'A2', distType: 'triangular', low: -10, mode: -4, high: 20 },
    ]);
    expect(durations.get('A2')).toBe(0);
    const perDay = { basis: 'per-day' as const, distType: 'fixed' as const, mode: 5, base: null };
    expect(lineBase({ ...perDay, activityCode: 'A2' }, durations)).toBe(0);
    expect(lineBase({ ...perDay, activityCode: 'A1' }, durations)).toBe(150);
    expect(lineBase({ ...perDay, activityCode: 'A9' }, durations)).toBeNull();
    expect(lineBase({ ...perDay, base: 42, activityCode: 'A2' }, durations)).toBe(42);
  });
});

describe('a line paid per project day', () => {
  // A1 (mode 30) then A2 (20, after a lag of 5), A3 (uniform 40–60, midpoint 50) in parallel:
  // the network's finish at base durations is max(30 + 5 + 20, 50) = 55 days (forward pass,
  // arithmetic of the rule in the header).
  const activities = [
    { id: 'A1', duration: { type: 'triangular' as const, low: 20, mode: 30, high: 50 } },
    { id: 'A2', duration: { type: 'fixed' as const, value: 20 }, predecessors: [{ id: 'A1', lag: 5 }] },
    { id: 'A3', duration: { type: 'uniform' as const, low: 40, high: 60 } },
  ];

  it('costs its rate’s base × the project’s base duration', () => {
    const model: Model = {
      format: 'outturn-model',
      version: 2,
      items: [
        { id: 'C9', ratePerDay: { type: 'triangular', low: 700, mode: 800, high: 1000 }, span: 'project' },
      ],
      activities,
    };
    // 800 (mode) × 55 days = 44,000.
    expect(baseEstimate(model)).toBe(44_000);
    // The engine's own base agrees (plumbing: the same rule on both sides).
    expect(simulateSync(model, { iterations: 200, seed: 3 }).cost.base).toBe(44_000);
  });

  it('gives the grid rows the same base from the schedule rows', () => {
    const rows = [
      { code: 'A1', distType: 'triangular' as const, low: 20, mode: 30, high: 50, predecessors: [] },
      { code: 'A2', distType: 'fixed' as const, mode: 20, predecessors: [{ code: 'A1', lag: 5 }] },
      { code: 'A3', distType: 'uniform' as const, low: 40, high: 60, predecessors: [] },
    ];
    const line = {
      basis: 'per-project-day' as const,
      distType: 'fixed' as const,
      mode: 800,
      base: null,
      activityCode: null,
    };
    expect(projectBaseDuration(rows)).toBe(55);
    expect(lineBase(line, activityBaseDurations(rows), projectBaseDuration(rows))).toBe(44_000);
    // Without a schedule there is no project duration: the line is incomplete, not 0.
    expect(lineBase(line, new Map(), projectBaseDuration([]))).toBeNull();
  });

  it('reads the rows’ link types and branches as the engine does', () => {
    // By hand (precedence diagramming, common practice): A1 runs 0–30. A2 (20 days) starts 10
    // days after A1 starts (SS+10): 10–30. A3 (15 days) finishes 5 days after A2 finishes
    // (FF+5): it ends at 35. A4 (40 days) exists with probability 0.3 and is left out of the
    // base (the engine's rule for a branch), so the project's base finish is 35 days.
    const rows = [
      { code: 'A1', distType: 'fixed' as const, mode: 30, predecessors: [] },
      {
        code: 'A2',
        distType: 'fixed' as const,
        mode: 20,
        predecessors: [{ code: 'A1', type: 'SS' as const, lag: 10 }],
      },
      {
        code: 'A3',
        distType: 'fixed' as const,
        mode: 15,
        predecessors: [{ code: 'A2', type: 'FF' as const, lag: 5 }],
      },
      {
        code: 'A4',
        distType: 'fixed' as const,
        mode: 40,
        predecessors: [{ code: 'A1', lag: 0 }],
        existence: 0.3,
      },
    ];
    expect(projectBaseDuration(rows)).toBe(35);
    const model: Model = {
      format: 'outturn-model',
      version: 2,
      items: [{ id: 'L1', ratePerDay: { type: 'fixed', value: 1000 }, span: 'project' }],
      activities: [
        { id: 'A1', duration: { type: 'fixed', value: 30 } },
        {
          id: 'A2',
          duration: { type: 'fixed', value: 20 },
          predecessors: [{ id: 'A1', type: 'SS', lag: 10 }],
        },
        {
          id: 'A3',
          duration: { type: 'fixed', value: 15 },
          predecessors: [{ id: 'A2', type: 'FF', lag: 5 }],
        },
        { id: 'A4', duration: { type: 'fixed', value: 40 }, predecessors: ['A1'], existence: 0.3 },
      ],
    };
    // The run's base agrees with the grid's: 1,000 a day × 35 days.
    expect(simulateSync(model, { iterations: 200, seed: 3 }).cost.base).toBe(35_000);
  });
});
