/**
 * Working-day calendars on ISO dates ('YYYY-MM-DD', read as UTC days): the organisation's working
 * week (ISO weekdays, 1 = Monday … 7 = Sunday) and its holidays. Without a calendar, Monday to
 * Friday with no holidays.
 *
 * Convention: a project starts at the beginning of its base date; its first working day is the
 * base date itself or, when that is not a working day, the next one. A duration of d working days
 * finishes at the end of working day ⌈d⌉, counted from that first day as day 1; so a finish target
 * date T is met when d ≤ workingDaysThrough(base, T).
 *
 * Counting uses whole weeks and then takes off the holidays: epoch day 0 (1970-01-01) was a
 * Thursday, so the working days before epoch day x are (whole 7-day cycles × working days a week)
 * + (working days among the first r days of the last cycle) − (holidays on working days before x).
 */

const DAY_MS = 86_400_000;

export type WorkCalendar = {
  /** ISO weekdays that are worked: 1 = Monday … 7 = Sunday. */
  weekdays: readonly number[];
  /** Days off on working weekdays, 'YYYY-MM-DD'. */
  holidays: readonly string[];
};

export const MONDAY_TO_FRIDAY: WorkCalendar = Object.freeze({
  weekdays: Object.freeze([1, 2, 3, 4, 5]),
  holidays: Object.freeze([]),
});

const floorDiv = (a: number, b: number) => Math.floor(a / b);

export function toEpochDay(iso: string): number {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(iso);
  if (!m) throw new RangeError(`Not an ISO date: ${iso}`);
  const t = Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]));
  return Math.round(t / DAY_MS);
}

export function fromEpochDay(day: number): string {
  return new Date(day * DAY_MS).toISOString().slice(0, 10);
}

/** 0 = Sunday … 6 = Saturday. */
export function weekdayOf(day: number): number {
  return (((day + 4) % 7) + 7) % 7;
}

type Compiled = {
  /** partial[r]: working weekdays among the first r days of a cycle starting on a Thursday. */
  partial: number[];
  perWeek: number;
  /** Holidays that fall on working weekdays, as sorted unique epoch days. */
  holidays: number[];
};

const compiledCache = new WeakMap<WorkCalendar, Compiled>();

function compile(calendar: WorkCalendar): Compiled {
  const cached = compiledCache.get(calendar);
  if (cached) return cached;
  const worked = new Set(calendar.weekdays.map((w) => w % 7)); // ISO 7 (Sunday) → 0, as weekdayOf
  if (worked.size === 0) throw new RangeError('A calendar needs at least one working weekday.');
  const partial = [0];
  for (let r = 0; r < 7; r++) partial.push(partial[r] + (worked.has(weekdayOf(r)) ? 1 : 0));
  const holidays = [...new Set(calendar.holidays.map(toEpochDay))]
    .filter((d) => worked.has(weekdayOf(d)))
    .sort((a, b) => a - b);
  const compiled = { partial, perWeek: partial[7], holidays };
  compiledCache.set(calendar, compiled);
  return compiled;
}

/** How many of the sorted days lie before x (binary search). */
function countBefore(sorted: number[], x: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (sorted[mid] < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** Working days among the epoch days [0, x) (negative x counts backwards, so differences work). */
function workingBefore(c: Compiled, x: number): number {
  const weeks = floorDiv(x, 7);
  return weeks * c.perWeek + c.partial[x - weeks * 7] - countBefore(c.holidays, x);
}

export function isWorkingDay(iso: string, calendar: WorkCalendar = MONDAY_TO_FRIDAY): boolean {
  const c = compile(calendar);
  const x = toEpochDay(iso);
  return workingBefore(c, x + 1) - workingBefore(c, x) === 1;
}

/** Working days from `base` through `date`, both included; 0 when date is before base. */
export function workingDaysThrough(
  base: string,
  date: string,
  calendar: WorkCalendar = MONDAY_TO_FRIDAY,
): number {
  const c = compile(calendar);
  const a = toEpochDay(base);
  const b = toEpochDay(date);
  if (b < a) return 0;
  return workingBefore(c, b + 1) - workingBefore(c, a);
}

/** The date on which a project starting on `base` finishes after `days` working days. */
export function finishDate(base: string, days: number, calendar: WorkCalendar = MONDAY_TO_FRIDAY): string {
  const c = compile(calendar);
  const n = Math.max(1, Math.ceil(days - 1e-9));
  const start = toEpochDay(base);
  // The finish is the first day x with n working days in [start, x]: find an upper bound, then bisect.
  const target = workingBefore(c, start) + n;
  let hi = start + 7 * Math.ceil(n / c.perWeek) + 7;
  while (workingBefore(c, hi + 1) < target) hi += hi - start + 7;
  let lo = start;
  while (lo < hi) {
    const mid = lo + floorDiv(hi - lo, 2);
    if (workingBefore(c, mid + 1) >= target) hi = mid;
    else lo = mid + 1;
  }
  return fromEpochDay(lo);
}

/** The calendar a run's dates are counted on: the one stored with it, else Monday to Friday. */
export function calendarOfRun(settings: { calendar?: WorkCalendar | null }): WorkCalendar {
  return settings.calendar ?? MONDAY_TO_FRIDAY;
}

const WEEKDAY_NAMES = ['', 'Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday', 'Sunday'];

/** "Monday to Friday", "Sunday to Thursday", or a list when the days are not a run of the week. */
export function weekText(weekdays: readonly number[]): string {
  const days = [...new Set(weekdays)].sort((a, b) => a - b);
  if (days.length === 7) return 'every day of the week';
  // A run of consecutive days may wrap past Sunday (e.g. 7, 1, 2, 3, 4 is Sunday to Thursday).
  const start = days.find((d) => !days.includes(d === 1 ? 7 : d - 1));
  if (start !== undefined) {
    const run = [start];
    while (days.includes((run[run.length - 1] % 7) + 1) && run.length < days.length) {
      run.push((run[run.length - 1] % 7) + 1);
    }
    if (run.length === days.length && days.length > 2) {
      return `${WEEKDAY_NAMES[start]} to ${WEEKDAY_NAMES[run[run.length - 1]]}`;
    }
    if (run.length === days.length) return run.map((d) => WEEKDAY_NAMES[d]).join(' and ');
  }
  return days.map((d) => WEEKDAY_NAMES[d]).join(', ');
}

/** One line saying which calendar dates are counted on, e.g. "Monday to Friday, less 12 holidays". */
export function calendarText(calendar: WorkCalendar): string {
  const n = calendar.holidays.length;
  return `${weekText(calendar.weekdays)}${n ? `, less ${n} holiday${n === 1 ? '' : 's'}` : ''}`;
}
