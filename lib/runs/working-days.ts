/**
 * A Monday-to-Friday working-day calendar on ISO dates ('YYYY-MM-DD', read as UTC days).
 *
 * Convention: a project starts at the beginning of its base date; its first working day is the
 * base date itself or, on a weekend, the Monday after. A duration of d working days finishes at
 * the end of working day ⌈d⌉, counted from that first day as day 1; so a finish target date T is
 * met when d ≤ workingDaysThrough(base, T).
 *
 * Counting uses whole weeks: 1970-01-01 (epoch day 0) was a Thursday, so in every 7-day cycle
 * from epoch day 0 the working days are offsets 0, 1, 4, 5, 6 (Thu, Fri, Mon, Tue, Wed).
 */

const DAY_MS = 86_400_000;
const WORKING_OFFSETS = [0, 1, 4, 5, 6] as const;
/** Working days among the first r days of a cycle, r = 0…7. */
const PARTIAL = [0, 1, 2, 2, 2, 3, 4, 5] as const;

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

export function isWorkingDay(iso: string): boolean {
  const w = weekdayOf(toEpochDay(iso));
  return w >= 1 && w <= 5;
}

/** Working days in the epoch days [0, x) (negative x counts backwards, so differences work). */
function workingBefore(x: number): number {
  const weeks = floorDiv(x, 7);
  return weeks * 5 + PARTIAL[x - weeks * 7];
}

/** Working days from `base` through `date`, both included; 0 when date is before base. */
export function workingDaysThrough(base: string, date: string): number {
  const a = toEpochDay(base);
  const b = toEpochDay(date);
  if (b < a) return 0;
  return workingBefore(b + 1) - workingBefore(a);
}

/** The date on which a project starting on `base` finishes after `days` working days. */
export function finishDate(base: string, days: number): string {
  const n = Math.max(1, Math.ceil(days - 1e-9));
  // The n-th working day on or after base is the (before(base) + n)-th working day since epoch day 0.
  const k = workingBefore(toEpochDay(base)) + n - 1;
  const weeks = floorDiv(k, 5);
  return fromEpochDay(weeks * 7 + WORKING_OFFSETS[k - weeks * 5]);
}
