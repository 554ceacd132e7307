import { describe, expect, it } from 'vitest';
import { FILE_COLUMNS, mapHeaders, readCell, writeCell } from '@/lib/registers/columns';
import {
  impactMean,
  mitigationMean,
  mitigationParts,
  readCodeList,
  riskDirection,
} from '@/lib/registers/risk-fields';

const column = (field: string) => FILE_COLUMNS.risks.find((c) => c.field === field)!;

describe('a risk’s lists of codes in cells and files', () => {
  it('reads a typed or pasted list, whatever the separators', () => {
    expect(readCodeList('A-10, A-20;A-30  A-40')).toEqual(['A-10', 'A-20', 'A-30', 'A-40']);
    expect(readCodeList('')).toEqual([]);
    expect(readCodeList(['1.1', '1.2'])).toEqual(['1.1', '1.2']);
  });

  it('writes a list as one cell and reads it back; an empty list is an empty cell', () => {
    const col = column('activityCodes');
    expect(writeCell(col, ['A2', 'A3'])).toBe('A2, A3');
    expect(readCell(col, 'A2, A3')).toEqual(['A2', 'A3']);
    expect(writeCell(col, [])).toBeNull();
    expect(readCell(col, '')).toEqual([]);
  });

  it('maps the single "Activity" column of an older file onto the list of activities', () => {
    expect(mapHeaders('risks', ['Code', 'Activity', 'Cost lines'])).toEqual([
      'code',
      'activityCodes',
      'itemCodes',
    ]);
  });
});

describe('threats and opportunities', () => {
  const tri = { costType: 'triangular', costLow: -90, costMode: -60, costHigh: -20 };

  it('names a risk by the sign of its mean impacts', () => {
    // Triangular mean (a + c + b) / 3 (definition of the triangular distribution): (−90 − 60 − 20) / 3 < 0.
    expect(impactMean(tri, 'cost')).toBeCloseTo(-170 / 3, 10);
    expect(riskDirection(tri)).toBe('opportunity');
    expect(riskDirection({ ...tri, delayType: 'fixed', delayMode: 5 })).toBe('both');
    expect(riskDirection({ costType: 'fixed', costMode: 10 })).toBe('threat');
    expect(riskDirection({ costType: 'fixed', costMode: null })).toBeNull();
  });

  it('reads a post impact with no cells of its own as the impact before it', () => {
    expect(impactMean(tri, 'postCost')).toBe(impactMean(tri, 'cost'));
    // Normal mean μ (definition): the post cells give their own.
    const normal = { costType: 'normal', costMean: 100, costSd: 10, postCostMean: 40, postCostSd: 5 };
    expect(impactMean(normal, 'postCost')).toBe(40);
  });

  it('reads a response cost as one amount, or a range with its mean', () => {
    expect(mitigationParts({ mitigationCost: 500 })).toEqual({ type: 'fixed', mode: 500 });
    expect(mitigationParts({})).toBeNull();
    expect(mitigationMean({})).toBe(0);
    // Uniform mean (a + b) / 2 (definition of the uniform distribution): (400 + 900) / 2 = 650.
    expect(mitigationMean({ mitigationType: 'uniform', mitigationLow: 400, mitigationHigh: 900 })).toBe(650);
  });
});
