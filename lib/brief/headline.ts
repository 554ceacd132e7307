/**
 * The brief's headline: what funding at the chosen level buys, in cost and in time, and how it
 * stands against both targets. Printed at the top of the page and of the PDF from this one
 * function. Rules:
 * - it names the scenario (before or after the planned responses);
 * - it always speaks of both targets, saying so when one was not set;
 * - when the funded level misses the finish target, that comes first, with the date it does
 *   reach: a budget figure must never read as the whole answer while the date is lost.
 */
import { formatDate, formatMoney } from '@/lib/runs/format';
import type { BriefData } from './build';
import { probabilityText } from './format';

const days = (n: number) =>
  `${Math.round(n).toLocaleString('en-GB')} working day${Math.round(n) === 1 ? '' : 's'}`;

export function headlineSentences(brief: BriefData): string[] {
  const money = (v: number) => formatMoney(v, brief.project.currency);
  const { level, value, amount } = brief.contingency;
  const scenario =
    brief.scenario.used === 'post' ? 'after the planned risk responses' : 'before any risk response';
  const finish = brief.finish;
  const out: string[] = [];

  let opening = `Funding at ${level} (${scenario}) means a budget of ${money(value)}: ${money(amount)} of contingency over the base estimate of ${money(brief.cost.base)}`;
  if (finish)
    opening += `; at ${finish.atLevel.level} the project finishes by ${formatDate(finish.atLevel.date)}`;
  out.push(`${opening}.`);

  const costTarget = brief.cost.target;
  const finishTarget = brief.duration?.target ?? null;
  const targetDate = finish?.target?.date ? formatDate(finish.target.date) : null;
  const finishTargetText = targetDate ?? (finishTarget ? days(finishTarget.value) : '');

  if (finishTarget && finish?.target?.missedAtLevel) {
    const late = finish.atLevel.days - finishTarget.value;
    out.push(
      `The finish target of ${finishTargetText} is missed: at ${level} the project finishes ${days(Math.ceil(late))} later, ` +
        `and the chance of finishing by the target is only ${probabilityText(finishTarget.probability)}.`,
    );
  } else if (finishTarget) {
    out.push(
      `The chance of finishing by the target of ${finishTargetText} is ${probabilityText(finishTarget.probability)}.`,
    );
  }
  if (costTarget)
    out.push(
      `The chance of staying within the cost target of ${money(costTarget.value)} is ${probabilityText(costTarget.probability)}.`,
    );
  if (costTarget && finishTarget && brief.joint)
    out.push(`The chance of meeting both targets together is ${probabilityText(brief.joint.probability)}.`);
  if (!costTarget && !finishTarget) out.push('The run was given neither a cost target nor a finish target.');
  else if (!finishTarget)
    out.push('No finish target was given, so the chance of finishing on time is not known.');
  else if (!costTarget)
    out.push('No cost target was given, so the chance of staying within budget is not known.');
  return out;
}

export function headlineText(brief: BriefData): string {
  return headlineSentences(brief).join(' ');
}
