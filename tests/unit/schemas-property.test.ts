// Property-based tests (fast-check) of the register row schemas and the engine's model schema:
// random and extreme values — NaN, ±Infinity, 1e308, −0, huge strings, formula-like codes — are
// either accepted within the stated bounds or refused with an issue that names the row and field.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { MAX_DAYS, MAX_FACTOR, MAX_MONEY, parseRows, type RegisterKind } from '@/lib/validation/registers';
import { validateModel } from '@/lib/sim';

/** Cases of each property below: 4 register schemas and the model schema, 1,500 in all. */
const RUNS = 300;

const extreme = fc.oneof(
  fc.constantFrom(
    NaN,
    Infinity,
    -Infinity,
    1e308,
    -1e308,
    Number.MAX_VALUE,
    -0,
    1e13,
    1e13 + 1,
    1e5,
    1e5 + 1,
  ),
  fc.double(),
  fc.integer(),
  fc.double({ min: -1e6, max: 1e6, noNaN: true }),
);
const anyValue = fc.oneof(
  extreme,
  fc.string(),
  fc.string({ minLength: 250, maxLength: 5000 }),
  fc.constantFrom('=HYPERLINK("http://evil.example","x")', '+cmd|calc', '@SUM(A1)', '-2+3', '', ' ', null),
);
const code = fc.oneof(fc.stringMatching(/^[A-Za-z0-9][A-Za-z0-9._\-/]{0,39}$/), anyValue);

const numberFields: Record<RegisterKind, { field: string; max: number }[]> = {
  items: ['low', 'mode', 'high', 'mean', 'sd', 'base'].map((field) => ({ field, max: MAX_MONEY })),
  risks: [
    ...['costLow', 'costMode', 'costHigh', 'mitigationCost'].map((field) => ({ field, max: MAX_MONEY })),
    ...['delayLow', 'delayMode', 'delayHigh'].map((field) => ({ field, max: MAX_DAYS })),
  ],
  activities: ['low', 'mode', 'high', 'mean', 'sd'].map((field) => ({ field, max: MAX_DAYS })),
  correlations: [{ field: 'rho', max: 1 }],
  // A factor is at least 0 (engine rule) and at most MAX_FACTOR (the register's own bound).
  drivers: ['low', 'mode', 'high'].map((field) => ({ field, max: MAX_FACTOR })),
};

const rowOf: Record<RegisterKind, fc.Arbitrary<Record<string, unknown>>> = {
  items: fc.record({
    code,
    description: anyValue,
    distType: fc.constantFrom('fixed', 'uniform', 'triangular', 'pert', 'normal', 'lognormal', null, 'bogus'),
    low: anyValue,
    mode: anyValue,
    high: anyValue,
    mean: anyValue,
    sd: anyValue,
    base: anyValue,
  }),
  risks: fc.record({
    code,
    title: anyValue,
    probability: anyValue,
    costType: fc.constantFrom('fixed', 'uniform', 'triangular', 'pert', 'lognormal', null),
    costLow: anyValue,
    costMode: anyValue,
    costHigh: anyValue,
    delayType: fc.constantFrom('uniform', 'triangular', null),
    delayLow: anyValue,
    delayMode: anyValue,
    delayHigh: anyValue,
    activityCodes: fc.constantFrom(['A1'], [], null),
    mitigationCost: anyValue,
  }),
  activities: fc.record({
    code,
    name: anyValue,
    distType: fc.constantFrom('fixed', 'uniform', 'triangular', 'pert', 'normal', 'lognormal'),
    low: anyValue,
    mode: anyValue,
    high: anyValue,
    mean: anyValue,
    sd: anyValue,
  }),
  correlations: fc.record({ aCode: code, bCode: code, rho: anyValue }),
  drivers: fc.record({
    code,
    name: anyValue,
    probability: anyValue,
    distType: fc.constantFrom('fixed', 'uniform', 'triangular', 'pert', 'lognormal', 'normal', null),
    range: fc.constantFrom('min-max', 'p10-p90', null),
    low: fc.oneof(anyValue, fc.constantFrom('-5%', '0.9', '+20%')),
    mode: fc.oneof(anyValue, fc.constantFrom('0%', '1', '1.05')),
    high: fc.oneof(anyValue, fc.constantFrom('+30%', '1.3', '12')),
    applies: fc.oneof(anyValue, fc.constantFrom('3.*', ['A1', '2.1'], [])),
  }),
};

describe('register row schemas under random and extreme values', () => {
  for (const kind of Object.keys(rowOf) as RegisterKind[]) {
    it(`${kind}: accepted rows are within bounds; refused rows name the row and field`, () => {
      fc.assert(
        fc.property(rowOf[kind], (row) => {
          const { data, issues } = parseRows(kind, [row]);
          if (data.length === 1) {
            const saved = data[0] as Record<string, unknown>;
            for (const { field, max } of numberFields[kind]) {
              const v = saved[field];
              if (v !== null && v !== undefined) {
                expect(Number.isFinite(v)).toBe(true);
                expect(Math.abs(v as number)).toBeLessThanOrEqual(max);
              }
            }
            const key = kind === 'correlations' ? ['aCode', 'bCode'] : ['code'];
            for (const k of key) expect(String(saved[k])).toMatch(/^[A-Za-z0-9][A-Za-z0-9._\-/]{0,39}$/);
            for (const text of ['description', 'title', 'name'])
              if (typeof saved[text] === 'string')
                expect((saved[text] as string).length).toBeLessThanOrEqual(255);
            expect(issues).toEqual([]);
          } else {
            expect(issues.length).toBeGreaterThan(0);
            for (const issue of issues) {
              expect(issue.path).toMatch(/^rows\[0\]\.[A-Za-z.0-9]+$/);
              expect(issue.message).toMatch(/^Row 1\b.*, [A-Za-z.0-9]+: \S/);
            }
          }
        }),
        { numRuns: RUNS },
      );
    });
  }
});

const dist = fc.oneof(
  fc.record({ type: fc.constant('fixed'), value: extreme }),
  fc.record({ type: fc.constant('uniform'), low: extreme, high: extreme }),
  fc.record({ type: fc.constantFrom('triangular', 'pert'), low: extreme, mode: extreme, high: extreme }),
  fc.record({ type: fc.constant('normal'), mean: extreme, sd: extreme }),
);
const modelOf = fc.record({
  format: fc.constant('outturn-model'),
  version: fc.constant(1),
  items: fc.array(fc.record({ id: code, dist }), { minLength: 1, maxLength: 3 }),
  activities: fc.array(fc.record({ id: code, duration: dist }), { maxLength: 2 }),
});

/** Numbers of a parsed value, with their paths. */
function numbers(node: unknown, at = ''): [string, number][] {
  if (typeof node === 'number') return [[at, node]];
  if (node === null || typeof node !== 'object') return [];
  return Object.entries(node).flatMap(([k, v]) => numbers(v, at ? `${at}.${k}` : k));
}

describe('the model schema under random and extreme values', () => {
  it('accepted models hold only finite numbers within bounds; refused ones name the entry', () => {
    fc.assert(
      fc.property(modelOf, (model) => {
        const r = validateModel(model);
        if (r.ok) {
          for (const [where, v] of numbers(r.model)) {
            expect(Number.isFinite(v), where).toBe(true);
            expect(Math.abs(v), where).toBeLessThanOrEqual(
              where.startsWith('activities') ? MAX_DAYS : MAX_MONEY,
            );
          }
        } else {
          expect(r.issues.length).toBeGreaterThan(0);
          // Each issue names its entry: "items[0] (C1).dist.low", or the list itself.
          for (const issue of r.issues) expect(issue.path).toMatch(/^(items|activities)(\[\d+\]( \(.*\))?)?/);
        }
      }),
      { numRuns: RUNS },
    );
  });
});
