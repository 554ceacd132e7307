import { describe, expect, it } from 'vitest';
import { registersToModel, type RegisterRecords, type RiskRecord } from '@/lib/domain/model-export';
import { validateModel } from '@/lib/sim';

const tri = (low: number, mode: number, high: number) => ({ type: 'triangular' as const, low, mode, high });

function risk(code: string, over: Partial<RiskRecord> = {}): RiskRecord {
  return {
    code,
    title: `Risk ${code}`,
    status: 'open',
    probability: 0.3,
    costImpact: tri(10, 20, 40),
    delayImpact: null,
    postProbability: null,
    postCostImpact: null,
    postDelayImpact: null,
    activityCodes: [],
    ...over,
  };
}

const records: RegisterRecords = {
  project: { name: 'Depot', currency: 'EUR' },
  items: [
    {
      code: 'C1',
      description: 'Civils',
      base: null,
      dist: tri(100, 150, 300),
      ratePerDay: null,
      activityCode: null,
    },
    { code: 'C2', description: 'Crane', base: null, dist: null, ratePerDay: 800, activityCode: 'A1' },
  ],
  risks: [
    risk('R1', { postProbability: 0.1, postCostImpact: tri(5, 10, 20) }),
    risk('R2', { status: 'closed' }),
    risk('R3', { delayImpact: tri(2, 5, 10), activityCodes: ['A1'] }),
  ],
  activities: [
    { code: 'A1', name: 'Build', duration: tri(20, 30, 50), predecessors: [] },
    { code: 'A2', name: 'Fit out', duration: tri(5, 8, 12), predecessors: [{ code: 'A1', lag: 2 }] },
  ],
  correlations: [
    { aCode: 'C1', bCode: 'R1', rho: 0.4 },
    { aCode: 'R2', bCode: 'C1', rho: 0.6 },
    { aCode: 'A1', bCode: 'A2', rho: 0.3 },
  ],
};

describe('registers → model file', () => {
  it('turns codes into ids and links into codes', () => {
    const { model } = registersToModel(records);
    expect(model.items).toEqual([
      { id: 'C1', name: 'Civils', dist: tri(100, 150, 300) },
      { id: 'C2', name: 'Crane', ratePerDay: 800, activity: 'A1' },
    ]);
    expect(model.activities).toEqual([
      { id: 'A1', name: 'Build', duration: tri(20, 30, 50), predecessors: [] },
      { id: 'A2', name: 'Fit out', duration: tri(5, 8, 12), predecessors: [{ id: 'A1', lag: 2 }] },
    ]);
    expect(model.risks?.find((r) => r.id === 'R3')).toMatchObject({
      delay: tri(2, 5, 10),
      activities: ['A1'],
    });
  });

  it('leaves out a closed risk and every correlation that names it, with a notice', () => {
    const { model, notices } = registersToModel(records);
    expect(model.risks?.map((r) => r.id)).toEqual(['R1', 'R3']);
    expect(model.correlations).toEqual([
      { a: 'C1', b: 'R1', rho: 0.4 },
      { a: 'A1', b: 'A2', rho: 0.3 },
    ]);
    expect(notices).toEqual([
      'Risk R2 (Risk R2) is closed: it is left out of the model.',
      'The correlation R2–C1 (ρ 0.6) is left out of the model: risk R2 is closed.',
    ]);
    // The engine accepts the result: no correlation names an input it does not hold.
    expect(validateModel(model).ok).toBe(true);
  });

  it('would hand the engine a model it refuses if the correlation were kept', () => {
    const { model } = registersToModel(records);
    const kept = { ...model, correlations: [...(model.correlations ?? []), { a: 'R2', b: 'C1', rho: 0.6 }] };
    const checked = validateModel(kept);
    expect(checked.ok).toBe(false);
    if (!checked.ok) expect(checked.issues.map((i) => i.message).join(' ')).toContain('unknown input "R2"');
  });

  it('says so when a correlation names a code no register holds', () => {
    const { model, notices } = registersToModel({
      ...records,
      correlations: [{ aCode: 'C1', bCode: 'X9', rho: 0.2 }],
    });
    expect(model.correlations).toEqual([]);
    expect(notices.at(-1)).toContain('no line item, risk, activity or driver has the code X9');
  });

  it('carries post-mitigation values as the post block and names the headline scenario', () => {
    const pre = registersToModel(records).model;
    expect(pre.risks?.[0]).toEqual({
      id: 'R1',
      name: 'Risk R1',
      probability: 0.3,
      cost: tri(10, 20, 40),
      post: { probability: 0.1, cost: tri(5, 10, 20) },
    });
    // R3 has no post values and no response cost: no post block, its values stand for both.
    expect(pre.risks?.[1]).not.toHaveProperty('post');
    expect(pre.settings).toEqual({ mitigation: 'pre' });
    expect(registersToModel(records, { riskValues: 'post' }).model.settings).toEqual({ mitigation: 'post' });
    expect(validateModel(pre).ok).toBe(true);
  });
});

describe('registers → model file, version 2 fields', () => {
  const v2: RegisterRecords = {
    ...records,
    items: [
      ...records.items,
      {
        code: 'C3',
        description: 'Site overheads',
        base: null,
        dist: null,
        ratePerDay: 120,
        activityCode: null,
        span: 'project',
      },
    ],
    risks: [
      risk('R4', {
        costImpact: { type: 'normal', mean: -50, sd: 10 },
        delayImpact: { type: 'lognormal', mean: 6, sd: 2 },
        activityCodes: ['A1', 'A2'],
        itemCodes: ['C1', 'C2'],
        sizes: 'independent',
        mitigationCost: { type: 'uniform', low: 5, high: 9 },
      }),
      risk('R5', { status: 'occurred', probability: 0.4, postProbability: 0.2, mitigationCost: 12 }),
    ],
    correlations: [],
  };

  it('writes several activities, cost lines, sizes, a response cost and a per-project-day line', () => {
    const { model } = registersToModel(v2);
    expect(model.version).toBe(2);
    expect(model.items[2]).toEqual({ id: 'C3', name: 'Site overheads', ratePerDay: 120, span: 'project' });
    expect(model.risks?.[0]).toEqual({
      id: 'R4',
      name: 'Risk R4',
      probability: 0.3,
      cost: { type: 'normal', mean: -50, sd: 10 },
      delay: { type: 'lognormal', mean: 6, sd: 2 },
      activities: ['A1', 'A2'],
      items: ['C1', 'C2'],
      sizes: 'independent',
      // A response cost alone still needs the post scenario, where the engine counts it.
      post: {},
      mitigationCost: { type: 'uniform', low: 5, high: 9 },
    });
    expect(validateModel(model).ok).toBe(true);
  });

  it('counts an occurred risk as certain before and after its response, with a notice', () => {
    const { model, notices } = registersToModel(v2);
    expect(model.risks?.[1]).toMatchObject({
      id: 'R5',
      probability: 1,
      post: { probability: 1 },
      mitigationCost: 12,
    });
    expect(notices).toEqual([
      'Risk R5 (Risk R5) has occurred: it counts as certain (probability 100%) until it is moved into the base estimate.',
    ]);
  });
});
