import { describe, expect, it } from 'vitest';
import { checkAgainstClass, ESTIMATE_CLASS_ACCURACY } from '@/lib/domain/estimate-class';
import { classCheckWarnings } from '@/lib/brief/wording';

// Worked cases against AACE International RP 18R-97, Table 1 (band values from memory of the
// published table): Class 3 is −10 % to −20 % on the low side and +10 % to +30 % on the high
// side; Class 5 is −20 % to −50 % and +30 % to +100 %. The ranges are measured around the
// estimate including contingency (about P50), as the practice defines them.
describe('estimate-class check', () => {
  it('holds the bands of the practice, widening from Class 1 to Class 5', () => {
    expect(ESTIMATE_CLASS_ACCURACY[3]).toEqual({
      lowBest: -0.1,
      lowWorst: -0.2,
      highBest: 0.1,
      highWorst: 0.3,
    });
    expect(ESTIMATE_CLASS_ACCURACY[5]).toEqual({
      lowBest: -0.2,
      lowWorst: -0.5,
      highBest: 0.3,
      highWorst: 1,
    });
    for (const c of [1, 2, 3, 4] as const) {
      const wider = ESTIMATE_CLASS_ACCURACY[(c + 1) as 2 | 3 | 4 | 5];
      expect(wider.highWorst).toBeGreaterThan(ESTIMATE_CLASS_ACCURACY[c].highWorst);
      expect(wider.lowWorst).toBeLessThan(ESTIMATE_CLASS_ACCURACY[c].lowWorst);
    }
  });

  it('measures around the P50, not the base', () => {
    // P10 90, P50 100, P90 125: −10 % and +25 % of the P50 (within Class 3). Around a base of
    // 80 the same figures would read +12.5 % and +56 %.
    const check = checkAgainstClass(3, 90, 100, 125);
    expect(check.reference).toBe(100);
    expect(check.simulatedLow).toBeCloseTo(-0.1, 12);
    expect(check.simulatedHigh).toBeCloseTo(0.25, 12);
    expect([check.low, check.high]).toEqual(['within', 'within']);
  });

  it('takes a range on the narrowest edge as within, and one just inside it as narrow (Class 3)', () => {
    expect(checkAgainstClass(3, 90, 100, 110)).toMatchObject({ low: 'within', high: 'within' });
    const narrow = checkAgainstClass(3, 91, 100, 109);
    expect([narrow.low, narrow.high]).toEqual(['narrow', 'narrow']);
    const [low, high] = classCheckWarnings(narrow);
    expect(low).toMatch(
      /low side the simulated P10 is −9.0 % of the P50, narrower than even the narrowest −10 %/,
    );
    expect(high).toMatch(
      /high side the simulated P90 is \+9.0 % of the P50, narrower than even the narrowest \+10 %/,
    );
  });

  it('takes a range on the widest edge as within, and one just beyond it as wide (Class 3)', () => {
    expect(checkAgainstClass(3, 80, 100, 130)).toMatchObject({ low: 'within', high: 'within' });
    const wide = checkAgainstClass(3, 79, 100, 131);
    expect([wide.low, wide.high]).toEqual(['wide', 'wide']);
    expect(classCheckWarnings(wide).join(' ')).toMatch(
      /wider than the widest −20 %.*wider than the widest \+30 %/,
    );
  });

  it('judges each side on its own: a Class 5 range narrow below and wide above', () => {
    // −10 % (narrower than −20 %) and +120 % (wider than +100 %).
    const check = checkAgainstClass(5, 90, 100, 220);
    expect([check.low, check.high]).toEqual(['narrow', 'wide']);
    // On both Class 5 edges: −50 % and +100 %.
    expect(checkAgainstClass(5, 50, 100, 200)).toMatchObject({ low: 'within', high: 'within' });
    expect(classCheckWarnings(checkAgainstClass(5, 50, 100, 200))).toEqual([]);
  });

  it('refuses an unknown class, a P50 that is not positive, or percentiles out of order', () => {
    expect(() => checkAgainstClass(6, 90, 100, 110)).toThrow(/1–5/);
    expect(() => checkAgainstClass(3, -1, 0, 10)).toThrow(/positive/);
    expect(() => checkAgainstClass(3, 110, 100, 120)).toThrow(/P10 ≤ P50 ≤ P90/);
  });
});
