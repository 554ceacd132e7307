import Papa from 'papaparse';

export type HolidayRow = { date: string; name: string };
export type HolidayCsv = { holidays: HolidayRow[]; errors: { line: number; message: string }[] };

const ISO = /^(\d{4})-(\d{2})-(\d{2})$/;

/** True for a real calendar date written YYYY-MM-DD (so 2027-02-30 is not one). */
export function isIsoDate(text: string): boolean {
  const m = ISO.exec(text);
  if (!m) return false;
  const d = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])));
  return d.toISOString().slice(0, 10) === text;
}

/**
 * Reads a list of holidays from CSV text: a date (YYYY-MM-DD) in the first column and an optional
 * name in the second, one holiday a line. A first line without a date is taken as headings. Dates
 * written another way are refused rather than guessed, since 03/04/2027 means March or April
 * depending on the country.
 */
export function parseHolidayCsv(text: string): HolidayCsv {
  const parsed = Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), { skipEmptyLines: 'greedy' });
  const holidays: HolidayRow[] = [];
  const errors: HolidayCsv['errors'] = [];
  const seen = new Set<string>();
  parsed.data.forEach((cells, index) => {
    const line = index + 1;
    const first = (cells[0] ?? '').trim().replace(/^'/, '');
    const name = (cells[1] ?? '').trim();
    if (isIsoDate(first)) {
      if (seen.has(first)) {
        errors.push({ line, message: `${first} is listed twice in the file; kept once.` });
        return;
      }
      if (name.length > 120) {
        errors.push({ line, message: `The name of ${first} is longer than 120 characters.` });
        return;
      }
      seen.add(first);
      holidays.push({ date: first, name });
      return;
    }
    if (index === 0 && /[a-z]/i.test(first)) return; // headings
    errors.push({
      line,
      message: ISO.test(first)
        ? `"${first}" is not a date of the calendar.`
        : `"${first}" is not a date written as YYYY-MM-DD (for example 2027-12-27).`,
    });
  });
  return { holidays, errors };
}
