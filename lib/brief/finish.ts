/**
 * The finish of the project as calendar dates: each confidence level's duration in working days
 * counted from the project's base date on the run's working calendar (lib/runs/working-days),
 * and the level the run funds at.
 */
import { finishDate, type WorkCalendar } from '@/lib/runs/working-days';
import type { PercentileKey, TotalSummary } from '@/lib/sim';

export type FinishLevel = { level: PercentileKey; days: number; date: string };

export type FinishBrief = {
  baseDate: string;
  /** The working calendar the run's days are counted on. */
  calendar: WorkCalendar;
  p50: FinishLevel;
  p80: FinishLevel;
  /** At the level the run funds at (P50, P70, P80 or P90). */
  atLevel: FinishLevel;
  /** The finish target, when given: its date, its working days, and whether the funded level misses it. */
  target: { date: string | null; days: number; missedAtLevel: boolean } | null;
};

export function finishBrief(
  duration: Pick<TotalSummary, 'percentiles'>,
  baseDate: string,
  level: PercentileKey,
  target: { days: number; date: string | null } | null,
  calendar: WorkCalendar,
): FinishBrief {
  const at = (key: PercentileKey): FinishLevel => {
    const days = duration.percentiles[key];
    return { level: key, days, date: finishDate(baseDate, days, calendar) };
  };
  const atLevel = at(level);
  return {
    baseDate,
    calendar,
    p50: at('P50'),
    p80: at('P80'),
    atLevel,
    target: target ? { ...target, missedAtLevel: atLevel.days > target.days + 1e-9 } : null,
  };
}

export type FinishRow = { key: string; label: string; date: string; days: number; wholeDays: boolean };

/**
 * The finish table's rows, earliest first: P50, P80 and the funded level (when it is neither),
 * then the target. Dates are ISO; the page and the PDF format them alike.
 */
export function finishRows(finish: FinishBrief): FinishRow[] {
  const levels = [finish.p50, finish.p80];
  if (!levels.some((r) => r.level === finish.atLevel.level)) levels.push(finish.atLevel);
  const rows: FinishRow[] = levels
    .sort((a, b) => a.days - b.days)
    .map((r) => ({
      key: r.level,
      label: r.level === finish.atLevel.level ? `${r.level} (funded level)` : r.level,
      date: r.date,
      days: r.days,
      wholeDays: false,
    }));
  if (finish.target)
    rows.push({
      key: 'target',
      label: 'Finish target',
      date: finish.target.date ?? finishDate(finish.baseDate, finish.target.days, finish.calendar),
      days: finish.target.days,
      wholeDays: true,
    });
  return rows;
}
