import { describe, expect, it } from 'vitest';
import { finishDate, isWorkingDay, workingDaysThrough } from '@/lib/runs/working-days';

// Reference: the weekdays below were read off a printed calendar (and Python's
// datetime.date.strftime('%A')): 2026-12-01 is a Tuesday, 2026-12-05 a Saturday,
// 2027-01-01 a Friday, 2024-02-29 a Thursday.
describe('working-day calendar (Mon–Fri)', () => {
  it('knows weekends', () => {
    expect(isWorkingDay('2026-12-01')).toBe(true);
    expect(isWorkingDay('2026-12-05')).toBe(false);
    expect(isWorkingDay('2026-12-06')).toBe(false);
    expect(isWorkingDay('2027-01-01')).toBe(true);
  });

  it('counts working days through a date, both ends included', () => {
    // Tue 1 Dec … Mon 7 Dec 2026: Tue, Wed, Thu, Fri, Mon = 5.
    expect(workingDaysThrough('2026-12-01', '2026-12-07')).toBe(5);
    expect(workingDaysThrough('2026-12-01', '2026-12-01')).toBe(1);
    // A Saturday base with a Sunday end holds no working day.
    expect(workingDaysThrough('2026-12-05', '2026-12-06')).toBe(0);
    expect(workingDaysThrough('2026-12-07', '2026-12-01')).toBe(0);
    // A leap year: Thu 29 Feb 2024 … Fri 8 Mar 2024 = Thu, Fri, Mon–Fri = 7.
    expect(workingDaysThrough('2024-02-29', '2024-03-08')).toBe(7);
  });

  it('finds the finish date of a duration', () => {
    expect(finishDate('2026-12-01', 1)).toBe('2026-12-01');
    expect(finishDate('2026-12-01', 4)).toBe('2026-12-04'); // Fri
    expect(finishDate('2026-12-01', 5)).toBe('2026-12-07'); // over the weekend to Mon
    expect(finishDate('2026-12-01', 4.2)).toBe('2026-12-07'); // part of day 5 is day 5
    expect(finishDate('2026-12-05', 1)).toBe('2026-12-07'); // a Saturday base starts on Monday
    expect(finishDate('2026-12-01', 0)).toBe('2026-12-01');
    // 23 working days from Tue 1 Dec 2026: 5 full weeks = 25 would be Mon 4 Jan;
    // 23 is Thu 31 Dec.
    expect(finishDate('2026-12-01', 23)).toBe('2026-12-31');
    expect(finishDate('2026-12-01', 24)).toBe('2027-01-01');
  });

  it('round-trips: a working day is the finish of the working days through it', () => {
    const base = '2026-11-27'; // a Friday
    for (let d = 0; d < 800; d++) {
      const date = new Date(Date.UTC(2026, 10, 27 + d)).toISOString().slice(0, 10);
      if (!isWorkingDay(date)) continue;
      expect(finishDate(base, workingDaysThrough(base, date))).toBe(date);
    }
  });

  it('agrees with a day-by-day count', () => {
    const base = '2025-06-14';
    let count = 0;
    for (let d = 0; d < 400; d++) {
      const dt = new Date(Date.UTC(2025, 5, 14 + d));
      const wd = dt.getUTCDay();
      if (wd !== 0 && wd !== 6) count++;
      expect(workingDaysThrough(base, dt.toISOString().slice(0, 10))).toBe(count);
    }
  });
});
