import { describe, expect, it } from 'vitest';
import { riskExposures, topRiskExposures } from '@/lib/brief/risk-exposure';

describe('risk exposure (probability × mean cost impact)', () => {
  const model = {
    risks: [
      // Triangular mean (a + b + c)/3 = (100 + 400 + 700)/3 = 400 (Johnson, Kotz & Balakrishnan 1995, ch. 26).
      {
        id: 'R1',
        name: 'Ground',
        probability: 0.25,
        cost: { type: 'triangular' as const, low: 100, mode: 400, high: 700 },
      },
      // PERT mean (a + 4m + b)/6 = (0 + 4·300 + 1200)/6 = 400 (Malcolm et al. 1959, beta-PERT, λ = 4).
      {
        id: 'R2',
        name: 'Permits',
        probability: 0.5,
        cost: { type: 'pert' as const, low: 0, mode: 300, high: 1200 },
      },
      // Uniform mean (a + b)/2 = 1000.
      {
        id: 'R3',
        name: 'Flood',
        probability: 0.05,
        cost: { type: 'uniform' as const, low: 500, high: 1500 },
      },
      // A delay-only risk costs nothing directly; its mean delay is 10 (fixed).
      { id: 'R4', probability: 0.9, delay: { type: 'fixed' as const, value: 10 }, activity: 'A1' },
    ],
  };

  it('computes expected cost from the distribution means and ranks largest first', () => {
    const ranked = riskExposures(model);
    expect(ranked.map((r) => r.id)).toEqual(['R2', 'R1', 'R3', 'R4']);
    expect(ranked[0].meanCost).toBeCloseTo(400, 9);
    expect(ranked[0].expectedCost).toBeCloseTo(200, 9);
    expect(ranked[1].expectedCost).toBeCloseTo(100, 9);
    expect(ranked[2].expectedCost).toBeCloseTo(50, 9);
    expect(ranked[3]).toMatchObject({ id: 'R4', name: 'R4', meanCost: 0, expectedCost: 0, meanDelay: 10 });
  });

  it('keeps only the top ones and never mutates the model', () => {
    const frozen = Object.freeze({ risks: Object.freeze([...model.risks]) });
    expect(topRiskExposures(frozen, 2).map((r) => r.id)).toEqual(['R2', 'R1']);
    expect(topRiskExposures({ risks: undefined })).toEqual([]);
  });
});

describe('risk exposure after the responses', () => {
  const model = {
    risks: [
      // Before: 0.4 × triangular mean (100 + 400 + 700)/3 = 0.4 × 400 = 160. After: probability 0.1
      // and a triangular (50, 200, 350) with mean 200, so 0.1 × 200 = 20 (triangular mean,
      // Johnson, Kotz & Balakrishnan 1995, ch. 26).
      {
        id: 'R1',
        probability: 0.4,
        cost: { type: 'triangular' as const, low: 100, mode: 400, high: 700 },
        post: { probability: 0.1, cost: { type: 'triangular' as const, low: 50, mode: 200, high: 350 } },
      },
      // Only the probability changes: the cost keeps its value before the response, uniform mean
      // (0 + 600)/2 = 300, so 0.5 × 300 = 150 before and 0.2 × 300 = 60 after.
      {
        id: 'R2',
        probability: 0.5,
        cost: { type: 'uniform' as const, low: 0, high: 600 },
        post: { probability: 0.2 },
      },
    ],
  };

  it('reads the post values where a risk has them and keeps the others', () => {
    expect(riskExposures(model).map((r) => [r.id, r.expectedCost])).toEqual([
      ['R1', 160],
      ['R2', 150],
    ]);
    const after = riskExposures(model, 'post');
    expect(after.map((r) => r.id)).toEqual(['R2', 'R1']);
    expect(after[0].expectedCost).toBeCloseTo(60, 9);
    expect(after[1].expectedCost).toBeCloseTo(20, 9);
    expect(after[1].probability).toBe(0.1);
  });
});
