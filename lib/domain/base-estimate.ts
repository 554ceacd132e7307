/**
 * The base (deterministic) estimate: the figure the registers add up to before any spread or
 * risk, and the figure contingency is measured from.
 *
 *   base of a distribution   mode (triangular, PERT), midpoint (uniform), mean (normal),
 *                            median (lognormal), value (fixed): the engine's Distribution.base
 *   base duration            max(0, base of the duration): a negative duration counts as 0 days
 *   base of a line           its base amount when given; otherwise the base of its distribution,
 *                            or for a rate per day: base of the rate × base duration of its activity,
 *                            or for a rate per project day: base of the rate × the project's base
 *                            duration (the network's finish with every activity at its base, not
 *                            the mean of the simulated durations)
 *   base estimate            Σ base of the lines (risk events are not in the base)
 *
 * The rule is the engine's (the compiler computes the run's base this way); it lives here once so
 * that the grid's base column, its total row and the projects list agree with the run's base.
 * See docs/model-format.md.
 */
import type { ModelActivity, ModelItem } from '@/lib/sim';
import { baseDurationOf, baseFinishOf, baseOf } from './engine';

export { baseOf };

/** The base duration of an activity: never below 0 days, as in the engine's schedule. */
export const baseDuration = baseDurationOf;

/** Base durations by activity id. */
export function baseDurations(
  activities: readonly Pick<ModelActivity, 'id' | 'duration'>[],
): Map<string, number> {
  return new Map(activities.map((a) => [a.id, baseDuration(a.duration)]));
}

/** The project's base duration in working days (null without a valid network). */
export const baseProjectDuration = (activities: readonly ModelActivity[]) => baseFinishOf(activities);

/**
 * The base of one line item; null when it is a rate per day whose activity (or, per project day,
 * whose schedule) has no base duration yet, so a grid can show the line as incomplete.
 */
export function itemBase(
  item: Omit<ModelItem, 'id'>,
  durations: ReadonlyMap<string, number>,
  projectDays: number | null = null,
): number | null {
  if (item.base !== undefined) return item.base;
  if (item.ratePerDay !== undefined) {
    const days =
      item.span === 'project'
        ? (projectDays ?? undefined)
        : item.activity === undefined
          ? undefined
          : durations.get(item.activity);
    if (days === undefined) return null;
    const rate = typeof item.ratePerDay === 'number' ? item.ratePerDay : baseOf(item.ratePerDay);
    return rate * days;
  }
  return item.dist ? baseOf(item.dist) : 0;
}

/** The base estimate of a model: the sum of its line items' bases. */
export function baseEstimate(model: {
  items: readonly ModelItem[];
  activities?: readonly ModelActivity[];
}): number {
  const durations = baseDurations(model.activities ?? []);
  const projectDays = baseProjectDuration(model.activities ?? []);
  return model.items.reduce((sum, item) => sum + (itemBase(item, durations, projectDays) ?? 0), 0);
}
