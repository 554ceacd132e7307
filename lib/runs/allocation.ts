/**
 * The contingency allocated to line items and risks (the result's `allocation`, an Euler
 * allocation: D. Tasche, "Risk contributions and performance measurement", 1999) as a table that
 * adds up: one row per line or risk, their sum, the contingency at the level, and the difference
 * between the two.
 *
 * Why a difference: each share is a mean over the iterations whose total lies nearest the P-value,
 * so the shares add up to the mean total of those iterations minus the base, while the contingency
 * is the P-value itself minus the base. The two differ by the Monte Carlo error of that window; the
 * table shows it rather than hiding it in a row.
 */
import type { AllocationResult } from '@/lib/sim';

export type AllocationRow = {
  code: string;
  name: string;
  kind: 'item' | 'risk';
  amount: number;
  /** amount / contingency; null when the contingency is 0. */
  share: number | null;
};

export type AllocationTable = {
  level: AllocationResult['level'];
  iterations: number;
  rows: AllocationRow[];
  /** Σ rows. */
  sum: number;
  contingency: number;
  /** sum − contingency. */
  difference: number;
};

/** Line codes in WBS order: "2.10" after "2.9", numbers compared as numbers. */
export const byCode = (a: string, b: string) => a.localeCompare(b, 'en', { numeric: true });

/** The table of an allocation: line items in WBS order, then risks in code order. */
export function allocationTable(
  allocation: AllocationResult,
  nameOf: (code: string) => string,
): AllocationTable {
  const { contingency } = allocation;
  const row =
    (kind: AllocationRow['kind']) =>
    ([code, amount]: [string, number]): AllocationRow => ({
      code,
      name: nameOf(code),
      kind,
      amount,
      share: contingency ? amount / contingency : null,
    });
  const sorted = (o: Record<string, number>) => Object.entries(o).sort(([a], [b]) => byCode(a, b));
  const rows = [...sorted(allocation.items).map(row('item')), ...sorted(allocation.risks).map(row('risk'))];
  // Summed in a fixed order, so the sum shown is the same wherever it is computed.
  const sum = rows.reduce((s, r) => s + r.amount, 0);
  return {
    level: allocation.level,
    iterations: allocation.iterations,
    rows,
    sum,
    contingency,
    difference: sum - contingency,
  };
}

/**
 * At most `max` rows for the screen: when there are more, the largest by size (in their order)
 * and one row holding all the others, so the rows shown still add up to the same sum.
 */
export function shownRows(
  table: AllocationTable,
  max = 30,
): { rows: AllocationRow[]; others: AllocationRow | null } {
  if (table.rows.length <= max) return { rows: table.rows, others: null };
  const keep = new Set(
    [...table.rows]
      .sort((a, b) => Math.abs(b.amount) - Math.abs(a.amount) || byCode(a.code, b.code))
      .slice(0, max - 1),
  );
  const rows = table.rows.filter((r) => keep.has(r));
  const rest = table.rows.filter((r) => !keep.has(r));
  const amount = rest.reduce((s, r) => s + r.amount, 0);
  return {
    rows,
    others: {
      code: '',
      name: `${rest.length} other lines and risks`,
      kind: 'item',
      amount,
      share: table.contingency ? amount / table.contingency : null,
    },
  };
}

/** The top level of a WBS code: "3" for "3.2.1"; the code itself when it has no level below. */
export const topLevelOf = (code: string) => code.split('.')[0];

/**
 * The same table summed by top-level WBS: one row per top-level branch of the line items (named
 * after the line whose code is the branch itself, when there is one), then one row for the risks
 * that name no line item. The rows add up to the same sum.
 */
export function byTopLevel(table: AllocationTable, nameOf: (code: string) => string): AllocationTable {
  const groups = new Map<string, number>();
  let risks = 0;
  let riskCount = 0;
  for (const r of table.rows) {
    if (r.kind === 'risk') {
      risks += r.amount;
      riskCount++;
    } else groups.set(topLevelOf(r.code), (groups.get(topLevelOf(r.code)) ?? 0) + r.amount);
  }
  const share = (amount: number) => (table.contingency ? amount / table.contingency : null);
  const rows: AllocationRow[] = [...groups.entries()]
    .sort(([a], [b]) => byCode(a, b))
    .map(([code, amount]) => ({
      code,
      name: nameOf(code) || `All lines under ${code}`,
      kind: 'item',
      amount,
      share: share(amount),
    }));
  if (riskCount)
    rows.push({
      code: '',
      name: `${riskCount} risk${riskCount === 1 ? '' : 's'} of their own`,
      kind: 'risk',
      amount: risks,
      share: share(risks),
    });
  return { ...table, rows };
}

/** The table as rows of cells for a CSV or a spreadsheet: header, one row per line, then the totals. */
export function allocationSheet(table: AllocationTable, currency: string): (string | number)[][] {
  const share = (v: number | null) => (v === null ? '' : Number(v.toFixed(6)));
  return [
    ['Code', 'Name', 'Kind', `Allocated at ${table.level} (${currency})`, 'Share of contingency'],
    ...table.rows.map((r) => [
      r.code,
      r.name,
      r.kind === 'item' ? 'line item' : 'risk',
      r.amount,
      share(r.share),
    ]),
    [
      '',
      'Sum of the allocated amounts',
      '',
      table.sum,
      share(table.contingency ? table.sum / table.contingency : null),
    ],
    ['', `Contingency at ${table.level}`, '', table.contingency, share(table.contingency ? 1 : null)],
    [
      '',
      `Monte Carlo difference (mean over the ${table.iterations} iterations nearest ${table.level}, less the ${table.level} itself)`,
      '',
      table.difference,
      share(table.contingency ? table.difference / table.contingency : null),
    ],
  ];
}
