import { describe, expect, it } from 'vitest';
import {
  calendarText,
  finishDate,
  isWorkingDay,
  weekText,
  workingDaysThrough,
} from '@/lib/runs/working-days';

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

// Dates below were counted by hand on a printed calendar: 2026-12-21 is a Monday, 2026-12-25 a
// Friday, 2026-12-26 a Saturday, 2027-01-01 a Friday, 2027-01-04 a Monday.
describe('working-day calendar with holidays and another working week', () => {
  const yearEnd = {
    weekdays: [1, 2, 3, 4, 5],
    holidays: ['2026-12-25', '2026-12-26', '2026-12-28', '2027-01-01'], // the 26th is a Saturday
  };

  it('skips holidays across a year end', () => {
    // Mon 21, Tue 22, Wed 23, Thu 24 = 4; Fri 25 and Mon 28 off; Tue 29 = 5, Wed 30 = 6, Thu 31 = 7;
    // Fri 1 Jan off; Mon 4 Jan = 8.
    expect(finishDate('2026-12-21', 4, yearEnd)).toBe('2026-12-24');
    expect(finishDate('2026-12-21', 5, yearEnd)).toBe('2026-12-29');
    expect(finishDate('2026-12-21', 7, yearEnd)).toBe('2026-12-31');
    expect(finishDate('2026-12-21', 8, yearEnd)).toBe('2027-01-04');
    expect(workingDaysThrough('2026-12-21', '2027-01-03', yearEnd)).toBe(7);
    expect(workingDaysThrough('2026-12-21', '2027-01-04', yearEnd)).toBe(8);
    expect(isWorkingDay('2026-12-25', yearEnd)).toBe(false);
    expect(isWorkingDay('2026-12-29', yearEnd)).toBe(true);
  });

  it('starts a project whose base date is a holiday on the next working day', () => {
    expect(finishDate('2026-12-25', 1, yearEnd)).toBe('2026-12-29');
    expect(workingDaysThrough('2026-12-25', '2026-12-28', yearEnd)).toBe(0);
  });

  it('counts a four-day and a six-day week', () => {
    const monToThu = { weekdays: [1, 2, 3, 4], holidays: [] };
    // Mon 7 Dec 2026 … Thu 10 Dec = 4 days; the fifth is Mon 14 Dec.
    expect(finishDate('2026-12-07', 4, monToThu)).toBe('2026-12-10');
    expect(finishDate('2026-12-07', 5, monToThu)).toBe('2026-12-14');
    const monToSat = { weekdays: [1, 2, 3, 4, 5, 6], holidays: [] };
    // Mon 7 … Sat 12 = 6; the seventh is Mon 14.
    expect(finishDate('2026-12-07', 6, monToSat)).toBe('2026-12-12');
    expect(finishDate('2026-12-07', 7, monToSat)).toBe('2026-12-14');
  });

  it('agrees with a day-by-day count written here, with holidays and a Sunday-to-Thursday week', () => {
    const calendar = {
      weekdays: [7, 1, 2, 3, 4],
      holidays: ['2026-03-01', '2026-04-09', '2026-04-10', '2026-12-31', '2027-01-03'],
    };
    const off = new Set(calendar.holidays);
    const base = '2026-02-26';
    let count = 0;
    for (let d = 0; d < 500; d++) {
      const dt = new Date(Date.UTC(2026, 1, 26 + d));
      const iso = dt.toISOString().slice(0, 10);
      const isoWeekday = dt.getUTCDay() === 0 ? 7 : dt.getUTCDay();
      const works = calendar.weekdays.includes(isoWeekday) && !off.has(iso);
      if (works) count++;
      expect(workingDaysThrough(base, iso, calendar)).toBe(count);
      if (works) expect(finishDate(base, count, calendar)).toBe(iso);
    }
  });

  it('refuses a week with no working day', () => {
    expect(() => finishDate('2026-12-07', 3, { weekdays: [], holidays: [] })).toThrow(/at least one/);
  });
});

describe('calendar wording', () => {
  it('names runs of days, wrapping past Sunday', () => {
    expect(weekText([1, 2, 3, 4, 5])).toBe('Monday to Friday');
    expect(weekText([7, 1, 2, 3, 4])).toBe('Sunday to Thursday');
    expect(weekText([6, 7])).toBe('Saturday and Sunday');
    expect(weekText([1, 3, 5])).toBe('Monday, Wednesday, Friday');
    expect(weekText([1, 2, 3, 4, 5, 6, 7])).toBe('every day of the week');
    expect(calendarText({ weekdays: [1, 2, 3, 4, 5], holidays: ['2026-12-25'] })).toBe(
      'Monday to Friday, less 1 holiday',
    );
  });
});
