/**
 * The schedule's health before a run: checks of the network's logic that a planner would make
 * before trusting a schedule risk analysis (common practice in schedule assessment). Each finding
 * names its activities. Findings never stop a run: the run form and the schedule tab list them.
 *
 * Rules (durations read at their base: the mode, midpoint, mean or median, as the base estimate):
 * - open start / open finish: an activity with no predecessor, or no successor, other than the
 *   project's start (the first listed activity without one) and its finish (the activity without
 *   a successor that finishes last in the base schedule, the last listed of a tie);
 * - dangling start: predecessors, but none that drives its start (FF and SF links only);
 *   dangling finish: successors, but none driven by its finish (SS and SF links only);
 * - leads: links with a negative lag;
 * - a lag longer than its successor's base duration;
 * - very long activities: a base duration over 44 working days;
 * - degenerate ranges (low = high, or a fixed duration) on the base schedule's critical path;
 * - the share of activities without uncertainty (a fixed or degenerate duration).
 */
import { baseDurationOf, checkNetwork, scheduleDates, type DistSpec, type ModelActivity } from '@/lib/sim';

/** Common practice in schedule assessment: an activity longer than this is hard to status. */
export const LONG_ACTIVITY_DAYS = 44;

export type HealthRule =
  | 'open-start'
  | 'open-finish'
  | 'dangling-start'
  | 'dangling-finish'
  | 'lead'
  | 'long-lag'
  | 'long-activity'
  | 'degenerate-critical'
  | 'no-uncertainty';

export interface HealthFinding {
  rule: HealthRule;
  /** One sentence naming the activities (and links) concerned. */
  message: string;
  /** Codes of the activities concerned, in the schedule's order. */
  activities: string[];
}

/** Each rule's title, as the schedule tab, the run form and the brief show it. */
export const HEALTH_RULE_TITLES: Record<HealthRule, string> = {
  'open-start': 'Open start',
  'open-finish': 'Open finish',
  'dangling-start': 'Dangling start',
  'dangling-finish': 'Dangling finish',
  lead: 'Lead',
  'long-lag': 'Long lag',
  'long-activity': 'Long activity',
  'degenerate-critical': 'No range on the critical path',
  'no-uncertainty': 'Activities without uncertainty',
};

type Link = { from: string; to: string; type: 'FS' | 'SS' | 'FF' | 'SF'; lag: number };

function linksOf(activities: readonly ModelActivity[]): Link[] {
  return activities.flatMap((a) =>
    (a.predecessors ?? []).map((p) =>
      typeof p === 'string'
        ? { from: p, to: a.id, type: 'FS' as const, lag: 0 }
        : { from: p.id, to: a.id, type: p.type ?? 'FS', lag: p.lag ?? 0 },
    ),
  );
}

/** A duration with no spread: fixed, or a range whose ends meet. */
export function withoutUncertainty(d: DistSpec): boolean {
  switch (d.type) {
    case 'fixed':
      return true;
    case 'uniform':
    case 'triangular':
    case 'pert':
      return d.low === d.high;
    case 'normal':
      return d.sd === 0;
    case 'lognormal':
      return 'p10' in d ? d.p10 === d.p90 : d.sd === 0;
  }
}

const baseDays = (d: DistSpec): number => {
  try {
    return baseDurationOf(d);
  } catch {
    return withoutUncertainty(d) ? Math.max(0, 'value' in d ? d.value : 'low' in d ? d.low : 0) : 0;
  }
};

const listed = (codes: string[]) =>
  codes.length <= 6 ? codes.join(', ') : `${codes.slice(0, 6).join(', ')} and ${codes.length - 6} more`;
const plural = (n: number, one: string, many: string) => (n === 1 ? one : many);
const signed = (lag: number) => (lag < 0 ? `−${-lag}` : `+${lag}`);
const linkText = (l: Link) => `${l.from} → ${l.to} (${l.type}${signed(l.lag)})`;

export function scheduleHealth(activities: readonly ModelActivity[]): HealthFinding[] {
  if (activities.length === 0) return [];
  const findings: HealthFinding[] = [];
  const add = (rule: HealthRule, message: string, codes: string[]) => {
    if (codes.length) findings.push({ rule, message, activities: codes });
  };
  const ids = new Set(activities.map((a) => a.id));
  const links = linksOf(activities).filter((l) => ids.has(l.from));
  const order = activities.map((a) => a.id);
  const inOrder = (set: Set<string>) => order.filter((id) => set.has(id));
  const durationOf = new Map(activities.map((a) => [a.id, baseDays(a.duration)]));
  const sound = checkNetwork([...activities]).length === 0;
  const dates = sound
    ? scheduleDates(
        [...activities],
        order.map((id) => durationOf.get(id)!),
      )
    : null;

  // Open ends.
  const hasPred = new Set(links.map((l) => l.to));
  const hasSucc = new Set(links.map((l) => l.from));
  const noPred = order.filter((id) => !hasPred.has(id));
  const noSucc = order.filter((id) => !hasSucc.has(id));
  const start = noPred[0];
  const finish = dates
    ? noSucc.reduce((best, id) =>
        dates.activities[id].earlyFinish >= dates.activities[best].earlyFinish ? id : best,
      )
    : noSucc[noSucc.length - 1];
  const openStarts = noPred.filter((id) => id !== start);
  const openFinishes = noSucc.filter((id) => id !== finish);
  add(
    'open-start',
    `${listed(openStarts)} ${plural(openStarts.length, 'has', 'have')} no predecessor: only the project's start (${start}) should begin without one.`,
    openStarts,
  );
  add(
    'open-finish',
    `${listed(openFinishes)} ${plural(openFinishes.length, 'has', 'have')} no successor: only the project's finish (${finish}) should end without one.`,
    openFinishes,
  );

  // Dangling starts and finishes.
  const startDriven = new Set(links.filter((l) => l.type === 'FS' || l.type === 'SS').map((l) => l.to));
  const finishDriving = new Set(links.filter((l) => l.type === 'FS' || l.type === 'FF').map((l) => l.from));
  const danglingStarts = order.filter((id) => hasPred.has(id) && !startDriven.has(id));
  const danglingFinishes = order.filter((id) => hasSucc.has(id) && !finishDriving.has(id));
  add(
    'dangling-start',
    `${listed(danglingStarts)}: no link drives the start (finish-to-finish or start-to-finish links only), so a late start would go unseen.`,
    danglingStarts,
  );
  add(
    'dangling-finish',
    `${listed(danglingFinishes)}: no link follows the finish (start-to-start or start-to-finish links only), so a late finish would delay nothing.`,
    danglingFinishes,
  );

  // Leads and long lags.
  const leads = links.filter((l) => l.lag < 0);
  add(
    'lead',
    `${plural(leads.length, 'A lead', 'Leads')} (negative lag): ${listed(leads.map(linkText))}; a lead lets work start before what it depends on is done.`,
    inOrder(new Set(leads.flatMap((l) => [l.from, l.to]))),
  );
  const longLags = links.filter((l) => l.lag > durationOf.get(l.to)!);
  add(
    'long-lag',
    `${plural(longLags.length, 'A lag', 'Lags')} longer than the successor's duration: ${listed(
      longLags.map((l) => `${linkText(l)}, ${l.to} lasts ${durationOf.get(l.to)} d`),
    )}; a long lag often hides work that should be an activity.`,
    inOrder(new Set(longLags.flatMap((l) => [l.from, l.to]))),
  );

  // Long activities.
  const long = order.filter((id) => durationOf.get(id)! > LONG_ACTIVITY_DAYS);
  add(
    'long-activity',
    `${listed(long)} ${plural(long.length, 'lasts', 'last')} over ${LONG_ACTIVITY_DAYS} working days; split long activities so that progress can be measured.`,
    long,
  );

  // Ranges.
  const flat = activities.filter((a) => withoutUncertainty(a.duration)).map((a) => a.id);
  const flatCritical = dates ? flat.filter((id) => dates.activities[id].critical) : [];
  add(
    'degenerate-critical',
    `${listed(flatCritical)} ${plural(flatCritical.length, 'is', 'are')} on the critical path with no range (low = high): the analysis cannot show their uncertainty.`,
    flatCritical,
  );
  const share = flat.length / activities.length;
  add(
    'no-uncertainty',
    `${flat.length} of ${activities.length} activities (${Math.round(share * 100)}%) ${plural(flat.length, 'has', 'have')} no uncertainty in ${plural(flat.length, 'its', 'their')} duration: ${listed(flat)}.`,
    flat,
  );
  return findings;
}
