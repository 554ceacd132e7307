import { describe, expect, it } from 'vitest';
import { checkAgainstClass, ESTIMATE_CLASS_ACCURACY } from '@/lib/brief/estimate-class';

describe('estimate-class accuracy check', () => {
  it('holds the published bands, narrowing from Class 5 to Class 1', () => {
    // AACE RP 18R-97 Table 1 (from memory): Class 3 is −10 %/−20 % to +10 %/+30 %.
    expect(ESTIMATE_CLASS_ACCURACY[3]).toEqual({
      lowBest: -0.1,
      lowWorst: -0.2,
      highBest: 0.1,
      highWorst: 0.3,
    });
    // AACE RP 18R-97 Table 1 (from memory): Class 5 is −20 %/−50 % to +30 %/+100 %.
    expect(ESTIMATE_CLASS_ACCURACY[5].highWorst).toBe(1);
    for (const c of [1, 2, 3, 4] as const) {
      const wider = ESTIMATE_CLASS_ACCURACY[(c + 1) as 2 | 3 | 4 | 5];
      expect(wider.highWorst).toBeGreaterThan(ESTIMATE_CLASS_ACCURACY[c].highWorst);
      expect(wider.lowWorst).toBeLessThan(ESTIMATE_CLASS_ACCURACY[c].lowWorst);
    }
  });

  it('warns when a Class 4 range is narrower than −15 % to +20 %', () => {
    const check = checkAgainstClass(4, 100, 95, 110);
    expect(check.simulatedLow).toBeCloseTo(-0.05, 12);
    expect(check.simulatedHigh).toBeCloseTo(0.1, 12);
    expect(check.widthRatio).toBeCloseTo(0.15 / 0.35, 12);
    expect(check.warning).toMatch(/narrower than even the narrowest range expected of a Class 4/);
  });

  it('does not warn when the range is as wide as the class expects', () => {
    expect(checkAgainstClass(4, 100, 82, 125).warning).toBeNull();
  });

  it('refuses an unknown class or a base that is not positive', () => {
    expect(() => checkAgainstClass(6, 100, 90, 110)).toThrow(/1–5/);
    expect(() => checkAgainstClass(3, 0, 90, 110)).toThrow(/positive/);
  });
});
