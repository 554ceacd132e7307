/**
 * The run's contingency allocation (Euler allocation, the result's `allocation` block) summed by
 * the first level of the WBS: "3.2.1" and "3.4" both belong to "3". A risk whose cost names line
 * items is already inside those items' shares; a risk that names none is shown on its own row.
 * The rows add up to the allocated contingency within Monte Carlo error.
 */
import type { AllocationResult, ContingencyLevel, Model } from '@/lib/sim';

export type AllocationRow = {
  /** The top-level WBS code, or null for the row of risks tied to no line item. */
  wbs: string | null;
  name: string;
  /** Line items in the branch (or risks on the risks' row). */
  count: number;
  amount: number;
  /** amount / contingency; null when the contingency is 0. */
  share: number | null;
};

export type AllocationBrief = {
  level: ContingencyLevel;
  contingency: number;
  rows: AllocationRow[];
  /** The sum of the rows. */
  total: number;
};

/** The first level of a WBS code: the part before its first separator (".", "-", "/" or a space). */
export function topLevelWbs(code: string): string {
  return code.trim().split(/[.\-/\s]/)[0] || code;
}

export function allocationByTopWbs(
  allocation: AllocationResult,
  model: Pick<Model, 'items'>,
): AllocationBrief {
  const names = new Map(model.items.map((i) => [i.id, i.name ?? i.id]));
  const order = new Map<string, number>();
  model.items.forEach((i, k) => {
    const top = topLevelWbs(i.id);
    if (!order.has(top)) order.set(top, k);
  });
  const groups = new Map<string, { amount: number; count: number }>();
  for (const [id, amount] of Object.entries(allocation.items)) {
    const top = topLevelWbs(id);
    const g = groups.get(top) ?? { amount: 0, count: 0 };
    g.amount += amount;
    g.count += 1;
    groups.set(top, g);
  }
  const share = (amount: number) => (allocation.contingency ? amount / allocation.contingency : null);
  const rows: AllocationRow[] = [...groups]
    .sort(
      ([a], [b]) =>
        (order.get(a) ?? Infinity) - (order.get(b) ?? Infinity) ||
        a.localeCompare(b, 'en', { numeric: true }),
    )
    .map(([wbs, g]) => ({
      wbs,
      // A line whose code is the branch itself names the branch; otherwise the code stands alone.
      name: names.get(wbs) ?? `WBS ${wbs}`,
      count: g.count,
      amount: g.amount,
      share: share(g.amount),
    }));
  const risks = Object.values(allocation.risks);
  if (risks.length) {
    const amount = risks.reduce((s, v) => s + v, 0);
    rows.push({
      wbs: null,
      name: 'Risk events tied to no line item',
      count: risks.length,
      amount,
      share: share(amount),
    });
  }
  return {
    level: allocation.level,
    contingency: allocation.contingency,
    rows,
    total: rows.reduce((s, r) => s + r.amount, 0),
  };
}
