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
    activityCode: null,
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
    risk('R3', { delayImpact: tri(2, 5, 10), activityCode: 'A1' }),
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
    expect(model.risks?.find((r) => r.id === 'R3')).toMatchObject({ delay: tri(2, 5, 10), activity: 'A1' });
  });

  it('leaves out a closed risk and every correlation that names it, with a notice', () => {
    const { model, notices } = registersToModel(records);
    expect(model.risks?.map((r) => r.id)).toEqual(['R1', 'R3']);
    expect(model.correlations).toEqual([
      { a: 'C1', b: 'R1', rho: 0.4 },
      { a: 'A1', b: 'A2', rho: 0.3 },
    ]);
    expect(notices).toEqual(['The correlation R2–C1 (ρ 0.6) is left out of the model: risk R2 is closed.']);
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
    expect(notices[0]).toContain('no line item, risk, activity or driver has the code X9');
  });

  it('uses post-mitigation values where given when asked', () => {
    const { model } = registersToModel(records, { riskValues: 'post' });
    expect(model.risks?.[0]).toEqual({ id: 'R1', name: 'Risk R1', probability: 0.1, cost: tri(5, 10, 20) });
    // R3 has no post values: it keeps its own.
    expect(model.risks?.[1]).toMatchObject({ probability: 0.3, cost: tri(10, 20, 40) });
  });
});
