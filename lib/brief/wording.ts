// Sentences the brief prints in more than one place (page, PDF).
import type { ClassCheck } from '@/lib/domain/estimate-class';
import { formatDays, formatMoney } from '@/lib/runs/format';
import { signedPercent } from './format';
import type { ScenarioBrief } from './scenario';

export const BRIEF_CAUTION =
  'Results are only as good as the ranges entered. They support, and do not replace, professional judgement, ' +
  'your organisation’s contingency policy and the funding body’s rules.';

/**
 * The simulated P10 and P90 as shares of the P50, to a tenth of a percent so that a side just
 * inside a band's edge does not read as on it: ["−8.1 %", "+9.6 %"].
 */
export function simulatedRangeText(check: ClassCheck): [string, string] {
  return [signedPercent(check.simulatedLow, 1), signedPercent(check.simulatedHigh, 1)];
}

/** The class's narrowest and widest range on each side: [["−10 %", "+10 %"], ["−20 %", "+30 %"]]. */
export function classBandsText(check: ClassCheck): { narrowest: [string, string]; widest: [string, string] } {
  const b = check.band;
  return {
    narrowest: [signedPercent(b.lowBest), signedPercent(b.highBest)],
    widest: [signedPercent(b.lowWorst), signedPercent(b.highWorst)],
  };
}

export const VERDICT_TEXT = {
  narrow: 'narrower than the class',
  within: 'within the class',
  wide: 'wider than the class',
};

/** What a verdict means, in a sentence for each side that is out of its band; none when both are within. */
export function classCheckWarnings(check: ClassCheck): string[] {
  const out: string[] = [];
  const sides = [
    ['low', 'P10', check.simulatedLow, check.band.lowBest, check.band.lowWorst],
    ['high', 'P90', check.simulatedHigh, check.band.highBest, check.band.highWorst],
  ] as const;
  for (const [side, p, value, best, worst] of sides) {
    const v = check[side];
    if (v === 'narrow')
      out.push(
        `On the ${side} side the simulated ${p} is ${signedPercent(value, 1)} of the P50, narrower than even the narrowest ` +
          `${signedPercent(best)} expected of a Class ${check.estimateClass} estimate. Check for optimistic ranges, ` +
          'missing risk events or missing correlation.',
      );
    if (v === 'wide')
      out.push(
        `On the ${side} side the simulated ${p} is ${signedPercent(value, 1)} of the P50, wider than the widest ` +
          `${signedPercent(worst)} expected of a Class ${check.estimateClass} estimate. The estimate may be less mature ` +
          'than its class, or large risks remain open.',
      );
  }
  return out;
}

/**
 * Separation of duties: the person who started a run does not also approve it as the baseline,
 * unless an owner has allowed self-approval for the organisation.
 */
export function selfApprovalRefusal(runNumber: number): string {
  return (
    `You started run ${runNumber}, so someone else must approve it as the baseline: a second person checks ` +
    'the inputs and the figures before money is committed (separation of duties). You may still return it. ' +
    'An owner can allow self-approval for a small organisation under Organisation settings.'
  );
}

/** What kind of input a driver is, in the brief's words. */
export const KIND_LABEL = {
  item: 'Line item',
  activity: 'Activity',
  risk: 'Risk event',
  driver: 'Risk driver',
} as const;

/** The scenario the figures are, in the brief's words. */
export const SCENARIO_TEXT = {
  pre: {
    title: 'Figures before any risk response (pre-mitigation)',
    detail: 'Every risk event counts with its probability and impact as they stand today.',
  },
  post: {
    title: 'Figures after the planned risk responses (post-mitigation)',
    detail: 'Risk events count with their probability and impact once the planned responses are in place.',
  },
} as const;

/** What the responses cost, in a sentence: the same on the page and in the PDF. */
export function responsesText(scenario: ScenarioBrief, currency: string): string {
  const r = scenario.responses;
  if (!r) return 'No response cost was entered.';
  return (
    `The ${r.count} response${r.count === 1 ? '' : 's'} with a cost are expected to cost ${formatMoney(r.expectedCost, currency)} in total` +
    (scenario.used === 'post' ? ', included in the figures.' : ', not included in these figures.')
  );
}

/** The two scenarios of one run side by side: [what, before, after, what the responses buy]. */
export function scenarioRows(scenario: ScenarioBrief, currency: string): [string, string, string, string][] {
  const c = scenario.compared;
  if (!c) return [];
  const money = (v: number) => formatMoney(v, currency);
  const days = (v: number) => formatDays(v);
  const rows: [string, number | null, number | null, (v: number) => string][] = [
    ['Cost P50', c.pre.costP50, c.post.costP50, money],
    ['Cost P80', c.pre.costP80, c.post.costP80, money],
    ['Duration P50', c.pre.durationP50, c.post.durationP50, days],
    ['Duration P80', c.pre.durationP80, c.post.durationP80, days],
  ];
  return rows
    .filter((r): r is [string, number, number, (v: number) => string] => r[1] !== null && r[2] !== null)
    .map(([label, pre, post, show]) => [
      label,
      show(pre),
      show(post),
      pre - post >= 0 ? `${show(pre - post)} less` : `${show(post - pre)} more`,
    ]);
}
