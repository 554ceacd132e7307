// The drivers register's own rules: what a typed "applies to" list covers, factors typed as
// percentage changes, the refusal of a factor range that can go below zero, and drivers in the
// model file. A factor of 1 + change/100 is the definition of a percentage change (common
// practice); the triangular quantile is the published one (Kotz & van Dorp, "Beyond Beta", 2004:
// F⁻¹(p) = a + √(p(b − a)(c − a)) for p ≤ (c − a)/(b − a)).
import { describe, expect, it } from 'vitest';
import { registersToModel, type RegisterRecords } from '@/lib/domain/model-export';
import { diffSnapshots } from '@/lib/runs/snapshot-diff';
import { parseToken, resolveApplies } from '@/lib/registers/driver-applies';
import { formatChange, formatRange, readFactor } from '@/lib/registers/driver-factor';
import { validateModel } from '@/lib/sim';
import { parseRows, rowIssues } from '@/lib/validation/registers';

const targets = { items: ['1.1', '3', '3.1', '3.2', '3.2.1', '31.1'], activities: ['A1', 'A2'] };

describe('what a driver applies to', () => {
  it('reads "3.*", "3.x" and "all of 3.x" as the branch 3, and a bare code as that code', () => {
    for (const typed of ['3.*', '3.x', '3.X', 'all of 3.x', 'All of 3'])
      expect(parseToken(typed)).toMatchObject({ kind: 'branch', prefix: '3' });
    expect(parseToken('3.2.1')).toMatchObject({ kind: 'code', code: '3.2.1' });
  });

  it('covers the branch head and every line below it, not a sibling that shares its digits', () => {
    // "31.1" begins with "3" but is not under 3: WBS levels are separated by dots.
    expect(resolveApplies(['3.*', 'A2'], targets)).toEqual({
      codes: ['3', '3.1', '3.2', '3.2.1', 'A2'],
      problems: [],
    });
  });

  it('names an unknown code, a branch that covers nothing, and a code of another register', () => {
    const { codes, problems } = resolveApplies(['C99', '7.*', 'R1', '1.1'], targets, new Set(['R1']));
    expect(codes).toEqual(['1.1']);
    expect(problems.map((p) => p.message)).toEqual([
      'unknown code "C99".',
      '"7.*" covers no line item or activity.',
      'R1 is not a line item or an activity; a driver scales those only.',
    ]);
  });
});

describe('a factor typed as a change or as a factor', () => {
  it('reads −5% as 0.95 and +20% as 1.2, whatever the row is entered as', () => {
    expect(readFactor('−5%', 'factor')).toBe(0.95);
    expect(readFactor('+20%', 'factor')).toBe(1.2);
    expect(readFactor('-5', 'change')).toBe(0.95);
    expect(readFactor('0.95', 'factor')).toBe(0.95);
  });

  it('shows a range both ways', () => {
    expect(formatRange([0.95, 1, 1.2], 'change')).toBe('\u22125% \u2026 0% \u2026 +20%');
    expect(formatRange([0.95, null, 1.2], 'factor')).toBe('0.95 \u2026 1.20');
    expect(formatChange(1.075)).toBe('+7.5%');
  });
});

const driver = (over: Record<string, unknown> = {}) => ({
  code: 'D1',
  name: 'Ground conditions',
  distType: 'triangular',
  range: 'min-max',
  low: '-5%',
  mode: '0%',
  high: '+20%',
  applies: '3.*, A1',
  ...over,
});

describe('the driver row', () => {
  it('stores factors, the list as typed, and a probability of 100% when none is given', () => {
    const { data, issues } = parseRows('drivers', [driver()]);
    expect(issues).toEqual([]);
    expect(data[0]).toMatchObject({ low: 0.95, mode: 1, high: 1.2, probability: 1, applies: ['3.*', 'A1'] });
  });

  it('refuses a P10–P90 range whose fitted low end falls below zero, and says so', () => {
    // Symmetric triangular with mode 1 and P10 0.3: half-width h solves 1 − h + h√0.2 = 0.3,
    // h = 0.7 / (1 − √0.2) ≈ 1.266, so the low end a = 1 − h ≈ −0.266 (Kotz & van Dorp).
    const h = 0.7 / (1 - Math.sqrt(0.2));
    expect(1 - h).toBeLessThan(0);
    const issues = rowIssues('drivers', driver({ range: 'p10-p90', low: 0.3, mode: 1, high: 1.7 }));
    expect(issues.low).toMatch(/below zero/);
    expect(issues.low).toMatch(/min–max instead of P10–P90/);
    // The same figures as absolute bounds stay above zero and are accepted.
    expect(rowIssues('drivers', driver({ low: 0.3, mode: 1, high: 1.7 }))).toEqual({});
  });

  it('refuses a negative factor, text that is neither, and an empty list, naming the cell', () => {
    expect(rowIssues('drivers', driver({ low: -0.2 })).low).toMatch(/below zero/);
    expect(rowIssues('drivers', driver({ high: 'lots' })).high).toMatch(/a factor such as 0\.95 or a change/);
    expect(rowIssues('drivers', driver({ applies: '' })).applies).toMatch(/Say what the driver applies to/);
  });
});

const records: RegisterRecords = {
  project: { name: 'Depot', currency: 'EUR' },
  items: [
    { code: '3.1', description: 'Piles', base: 100, dist: null, ratePerDay: null, activityCode: null },
    { code: '3.2', description: 'Slab', base: 200, dist: null, ratePerDay: null, activityCode: null },
    { code: '4.1', description: 'Roof', base: 50, dist: null, ratePerDay: null, activityCode: null },
  ],
  risks: [],
  activities: [{ code: 'A1', name: 'Build', duration: { type: 'fixed', value: 10 }, predecessors: [] }],
  correlations: [{ aCode: 'D1', bCode: 'D2', rho: 0.5 }],
  drivers: [
    {
      code: 'D1',
      name: 'Ground',
      probability: 1,
      factor: { type: 'triangular', low: 0.95, mode: 1, high: 1.3 },
      applies: ['3.*', 'A1'],
    },
    {
      code: 'D2',
      name: 'Market',
      probability: 0.6,
      factor: { type: 'uniform', low: 1, high: 1.1 },
      applies: ['4.1', 'C9'],
    },
    { code: 'D3', name: 'Gone', probability: 1, factor: { type: 'fixed', value: 1.1 }, applies: ['9.*'] },
  ],
};

describe('drivers in the model file', () => {
  it('resolves branches to the codes they cover now, keeps correlations between drivers, and is version 2', () => {
    const { model, notices } = registersToModel(records);
    expect(model.version).toBe(2);
    expect(model.drivers).toEqual([
      {
        id: 'D1',
        name: 'Ground',
        factor: { type: 'triangular', low: 0.95, mode: 1, high: 1.3 },
        applies: ['3.1', '3.2', 'A1'],
      },
      {
        id: 'D2',
        name: 'Market',
        probability: 0.6,
        factor: { type: 'uniform', low: 1, high: 1.1 },
        applies: ['4.1'],
      },
    ]);
    expect(model.correlations).toEqual([{ a: 'D1', b: 'D2', rho: 0.5 }]);
    expect(notices).toEqual([
      'The driver D2 skips C9: unknown code "C9".',
      'The driver D3 is left out of the model: it applies to no line item or activity.',
    ]);
    expect(validateModel(model).ok).toBe(true);
  });

  it('lets a line added under a branch join the driver', () => {
    const more = {
      ...records,
      items: [
        ...records.items,
        { code: '3.3', description: 'Walls', base: 10, dist: null, ratePerDay: null, activityCode: null },
      ],
    };
    expect(registersToModel(more).model.drivers?.[0].applies).toEqual(['3.1', '3.2', '3.3', 'A1']);
  });

  it('writes no drivers entry when the project has no drivers', () => {
    expect(registersToModel({ ...records, drivers: [], correlations: [] }).model).not.toHaveProperty(
      'drivers',
    );
  });
});

describe('drivers between two runs', () => {
  it('shows a driver whose branch took in a new line as a changed driver, naming the list', () => {
    const before = registersToModel(records).model;
    const after = registersToModel({
      ...records,
      items: [
        ...records.items,
        { code: '3.3', description: 'Walls', base: 10, dist: null, ratePerDay: null, activityCode: null },
      ],
    }).model;
    const drivers = diffSnapshots(before, after).lines.filter((l) => l.kind === 'driver');
    expect(drivers).toEqual([
      {
        kind: 'driver',
        id: 'D1',
        name: 'Ground',
        change: 'changed',
        fields: [{ field: 'applies', before: ['3.1', '3.2', 'A1'], after: ['3.1', '3.2', '3.3', 'A1'] }],
      },
    ]);
  });
});
