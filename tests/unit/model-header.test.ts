import { describe, expect, it } from 'vitest';
import { readModelHeader } from '@/lib/registers/model-header';
import { registersToModel } from '@/lib/domain/model-export';
import { validateModel } from '@/lib/sim';

describe('a model file’s project header', () => {
  it('gives a new project its name, currency, stage, class and base date', () => {
    const text = JSON.stringify({
      format: 'outturn-model',
      version: 2,
      name: 'Lock gate renewal',
      currency: 'gbp',
      project: { stage: 'Feasibility', estimateClass: 4, baseDate: '2027-04-05' },
      items: [],
    });
    expect(readModelHeader(text)).toEqual({
      name: 'Lock gate renewal',
      currency: 'GBP',
      stage: 'Feasibility',
      estimateClass: 4,
      baseDate: '2027-04-05',
    });
  });

  it('leaves out what the project form would refuse, and refuses what is not a model file', () => {
    const odd = JSON.stringify({
      format: 'outturn-model',
      project: { stage: 'Someday', estimateClass: 7, baseDate: '5/4/2027' },
    });
    expect(readModelHeader(odd)).toEqual({});
    expect(readModelHeader('{"format":"something-else"}')).toBeNull();
    expect(readModelHeader('not json')).toBeNull();
  });

  it('is written by the export and read by the engine’s schema, which refuses a bad class', () => {
    const { model } = registersToModel({
      project: { name: 'P', currency: 'EUR', stage: 'Tender', estimateClass: 2, baseDate: '2027-01-04' },
      items: [
        { code: '1', description: 'Line', base: 100, dist: null, ratePerDay: null, activityCode: null },
      ],
      risks: [],
      activities: [],
      correlations: [],
    });
    expect(model.project).toEqual({ stage: 'Tender', estimateClass: 2, baseDate: '2027-01-04' });
    expect(validateModel(model).ok).toBe(true);
    const bad = validateModel({ ...model, project: { estimateClass: 6 } });
    expect(bad.ok).toBe(false);
  });
});
