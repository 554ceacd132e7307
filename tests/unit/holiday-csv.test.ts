import { describe, expect, it } from 'vitest';
import { isIsoDate, parseHolidayCsv } from '@/lib/runs/holiday-csv';

describe('holiday list from CSV', () => {
  it('reads dates and names, skipping headings and blank lines', () => {
    const csv = '\uFEFFdate,name\n2027-01-01,New year\n\n2027-12-27,"Winter closure, day 1"\n2027-12-28\n';
    expect(parseHolidayCsv(csv)).toEqual({
      holidays: [
        { date: '2027-01-01', name: 'New year' },
        { date: '2027-12-27', name: 'Winter closure, day 1' },
        { date: '2027-12-28', name: '' },
      ],
      errors: [],
    });
  });

  it('names each refused line and keeps the good ones', () => {
    const csv = '2027-02-30,Not a day\n03/04/2027,Ambiguous\n2027-05-03,Spring\n2027-05-03,Again\n';
    const out = parseHolidayCsv(csv);
    expect(out.holidays).toEqual([{ date: '2027-05-03', name: 'Spring' }]);
    expect(out.errors).toEqual([
      { line: 1, message: '"2027-02-30" is not a date of the calendar.' },
      { line: 2, message: '"03/04/2027" is not a date written as YYYY-MM-DD (for example 2027-12-27).' },
      { line: 4, message: '2027-05-03 is listed twice in the file; kept once.' },
    ]);
  });

  it('knows real dates, leap days included (the Gregorian rule: 2028 is a leap year, 2027 is not)', () => {
    expect(isIsoDate('2028-02-29')).toBe(true);
    expect(isIsoDate('2027-02-29')).toBe(false);
    expect(isIsoDate('2027-13-01')).toBe(false);
  });
});
