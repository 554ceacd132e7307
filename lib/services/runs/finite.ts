import 'server-only';
// A run only succeeds with figures a person can act on: every headline figure of the cost and
// duration totals (base, mean, spread, extremes, percentiles, contingency) must be a finite
// number. Inputs that overflow the sums give NaN or Infinity, which must never reach an approval.

import type { SimulationResult, TotalSummary } from '@/lib/sim';

function figuresOf(total: TotalSummary): [string, number][] {
  return [
    ['base', total.base],
    ['mean', total.mean],
    ['standard deviation', total.sd],
    ['minimum', total.min],
    ['maximum', total.max],
    ...Object.entries(total.percentiles),
    ...Object.entries(total.contingency).map(([k, v]): [string, number] => [`${k} contingency`, v]),
  ];
}

/** The reason a result cannot be kept, or null when every headline figure is finite. */
export function nonFiniteReason(result: Pick<SimulationResult, 'cost' | 'duration'>): string | null {
  const totals: [string, TotalSummary | undefined][] = [
    ['cost', result.cost],
    ['duration', result.duration],
  ];
  for (const [name, total] of totals) {
    if (!total) continue;
    const bad = figuresOf(total).filter(([, v]) => !Number.isFinite(v));
    if (bad.length) {
      return `The run gave no usable ${name} figures (${bad
        .slice(0, 3)
        .map(([k, v]) => `${k} = ${v}`)
        .join(
          ', ',
        )}): some inputs are too large to add up. Check the registers' amounts and durations, then run again.`;
    }
  }
  return null;
}
