import { describe, expect, it } from 'vitest';
import { buildBrief, type BriefSource } from '@/lib/brief/build';
import { headlineSentences, headlineText } from '@/lib/brief/headline';
import type { Model, PercentileKey, SimulationResult, TotalSummary } from '@/lib/sim';

const KEYS: PercentileKey[] = ['P5', 'P10', 'P20', 'P30', 'P40', 'P50', 'P60', 'P70', 'P80', 'P90', 'P95'];

/** A total whose percentiles rise evenly from `low` (P5) to `high` (P95). */
function total(base: number, low: number, high: number, within?: number): TotalSummary {
  const percentiles = Object.fromEntries(
    KEYS.map((k, i) => [k, low + ((high - low) * i) / (KEYS.length - 1)]),
  ) as Record<PercentileKey, number>;
  return {
    base,
    mean: (low + high) / 2,
    sd: (high - low) / 4,
    min: low * 0.95,
    max: high * 1.05,
    percentiles,
    percentileCI95: Object.fromEntries(
      KEYS.map((k) => [k, [percentiles[k] * 0.99, percentiles[k] * 1.01]]),
    ) as never,
    contingency: { P50: percentiles.P50 - base, P80: percentiles.P80 - base, P90: percentiles.P90 - base },
    probabilityWithinTarget:
      within === undefined ? undefined : { value: within, ci95: [within - 0.01, within + 0.01] },
  };
}

function source(opts: {
  costTarget?: number;
  durationTarget?: number;
  finishTarget?: string | null;
  used?: 'pre' | 'post';
}): BriefSource {
  // The finish at P50 and P80: 250 and 260 working days.
  const duration = total(240, 250, 300, opts.durationTarget === undefined ? undefined : 0.18);
  duration.percentiles.P80 = 260;
  duration.percentiles.P50 = 250;
  const result = {
    format: 'outturn-result',
    version: 2,
    iterations: 10_000,
    seed: 1,
    sampling: 'lhs',
    elapsedMs: 1,
    cost: total(40_000_000, 42_000_000, 52_000_000, opts.costTarget === undefined ? undefined : 0.62),
    duration,
    joint: opts.costTarget && opts.durationTarget ? { probability: 0.15, ci95: [0.14, 0.16] } : undefined,
    sensitivity: { cost: [], duration: [] },
    criticality: {},
    achievedCorrelations: [],
    warnings: [],
    convergence: { iterations: [], cost: { P50: [], P50ci95: [], P80: [], P80ci95: [] } },
  } as unknown as SimulationResult;
  const snapshot: Model = {
    format: 'outturn-model',
    version: 2,
    items: [{ id: '1.1', name: 'Earthworks', base: 40_000_000 }],
    targets: { cost: opts.costTarget, duration: opts.durationTarget },
  };
  return {
    project: {
      id: 1,
      name: 'Canal lock',
      code: 'CL',
      currency: 'EUR',
      stage: 'Feasibility',
      estimateClass: 4,
      baseDate: '2027-01-04',
      assumptions: null,
      exclusions: null,
      version: 1,
    },
    run: {
      id: 7,
      number: 3,
      inputHash: 'x',
      startedByName: 'E',
      startedAt: null,
      finishedAt: null,
      confidence: 'P80',
      finishTarget: opts.finishTarget ?? null,
      riskValues: opts.used ?? 'pre',
      startedById: 3,
    },
    result,
    snapshot,
  };
}

describe('the brief headline', () => {
  it('puts a missed finish target first, with the date reached, and never the cost alone', () => {
    // 2027-01-04 is a Monday: 240 working days (48 five-day weeks) end on Friday 3 Dec 2027 and
    // 260 (52 weeks) on Friday 31 Dec 2027 (calendar counting, Monday to Friday).
    const brief = buildBrief(
      source({ costTarget: 50_000_000, durationTarget: 240, finishTarget: '2027-12-03' }),
    );
    const [opening, finish, cost, both] = headlineSentences(brief);
    // Cost P80 = 42 m + (52 m − 42 m) · 8/10 = 50 m; contingency 50 m − 40 m.
    expect(opening).toContain(
      'Funding at P80 (before any risk response) means a budget of €50,000,000: €10,000,000 of contingency over the base estimate of €40,000,000',
    );
    expect(opening).toContain('at P80 the project finishes by 31 Dec 2027');
    expect(finish).toBe(
      'The finish target of 3 Dec 2027 is missed: at P80 the project finishes 20 working days later, and the chance of finishing by the target is only 18.0 %.',
    );
    expect(cost).toBe('The chance of staying within the cost target of €50,000,000 is 62.0 %.');
    expect(both).toBe('The chance of meeting both targets together is 15.0 %.');
  });

  it('speaks of both targets when the finish is met, and says which scenario the figures are', () => {
    const brief = buildBrief(source({ costTarget: 50_000_000, durationTarget: 270, used: 'post' }));
    const text = headlineText(brief);
    expect(text).toContain('(after the planned risk responses)');
    // 270 working days from Monday 4 Jan 2027: 54 weeks, Friday 14 Jan 2028.
    expect(text).toContain('The chance of finishing by the target of 14 Jan 2028 is 18.0 %.');
    expect(text).toContain('cost target of €50,000,000 is 62.0 %');
    expect(text).not.toContain('missed');
  });

  it('says when a target was not given rather than leave the cost figure on its own', () => {
    const costOnly = headlineText(buildBrief(source({ costTarget: 50_000_000 })));
    expect(costOnly).toContain(
      'No finish target was given, so the chance of finishing on time is not known.',
    );
    const none = headlineText(buildBrief(source({})));
    expect(none).toContain('The run was given neither a cost target nor a finish target.');
  });
});

describe('the brief on the run’s calendar and network', () => {
  it('counts finish dates on the calendar stored with the run', () => {
    // 260 working days from Monday 4 Jan 2027 end on Friday 31 Dec 2027 (52 five-day weeks); with
    // 31 Dec a holiday the 260th working day is Monday 3 Jan 2028 (counted by hand).
    const plain = buildBrief(source({}));
    expect(plain.finish?.p80.date).toBe('2027-12-31');
    const withHoliday = source({});
    withHoliday.run.calendar = { weekdays: [1, 2, 3, 4, 5], holidays: ['2027-12-31'] };
    expect(buildBrief(withHoliday).finish?.p80.date).toBe('2028-01-03');
  });

  it('lists the schedule health findings of the network the run read', () => {
    const withLead = source({});
    withLead.snapshot.activities = [
      {
        id: 'A1',
        name: 'Dig',
        duration: { type: 'triangular', low: 10, mode: 12, high: 16 },
        predecessors: [],
      },
      {
        id: 'A2',
        name: 'Pour',
        duration: { type: 'triangular', low: 5, mode: 6, high: 9 },
        predecessors: [{ id: 'A1', type: 'FS', lag: -2 }],
      },
    ];
    const health = buildBrief(withLead).scheduleHealth;
    expect(health.activityCount).toBe(2);
    // A negative lag is a lead (common practice in schedule assessment: leads are flagged).
    expect(health.findings.map((f) => f.rule)).toContain('lead');
    expect(health.findings.find((f) => f.rule === 'lead')?.activities).toEqual(['A1', 'A2']);
  });
});
