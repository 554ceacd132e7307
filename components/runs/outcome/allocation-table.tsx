'use client';

import { useState } from 'react';
import { TableHead } from '@/components/ui/table';
import { buttonClass } from '@/components/ui/button';
import { shownRows, type AllocationTable as Table } from '@/lib/runs/allocation';

/**
 * Where the contingency at the level sits: one row per line item (with the risks that name it)
 * and per risk of its own, the sum of the rows, the contingency, and the Monte Carlo difference
 * between the two, said rather than hidden. Long tables show their largest rows and one row for the
 * rest; the downloads hold every row.
 */
export function AllocationTable({
  table: lines,
  grouped,
  chosen,
  money,
  share,
  download,
}: {
  table: Table;
  /** The same table summed by top-level WBS. */
  grouped: Table;
  /** The level the run's settings chose (the allocation may be at another for older runs). */
  chosen: string;
  money: (v: number) => string;
  share: (v: number) => string;
  download: { csv: string; xlsx: string };
}) {
  const [view, setView] = useState<'lines' | 'wbs'>('lines');
  const table = view === 'lines' ? lines : grouped;
  const { rows, others } = shownRows(table);
  const cell = 'num py-0.5 pl-3';
  const pct = (v: number | null) => (v === null ? '—' : share(v));
  return (
    <div className="space-y-2 rounded border border-rule bg-paper-raised p-3">
      <div className="flex items-start gap-3">
        <p className="text-sm text-ink-soft">
          The contingency at {table.level} held for each line item and risk: each row is its mean cost over
          the {table.iterations} iterations whose total lies nearest {table.level}, less its base. A risk that
          names line items is counted in their rows.
          {table.level !== chosen
            ? ` This run allocated at ${table.level}; the level chosen for it was ${chosen}.`
            : ''}
        </p>
        <div className="ml-auto flex shrink-0 gap-2">
          <div role="group" aria-label="Rows of the allocation" className="flex">
            {(
              [
                ['lines', 'Lines and risks'],
                ['wbs', 'Top-level WBS'],
              ] as const
            ).map(([key, label], i) => (
              <button
                key={key}
                type="button"
                aria-pressed={view === key}
                onClick={() => setView(key)}
                className={`border border-rule-strong px-3 py-1.5 text-sm ${i ? 'rounded-r border-l-0' : 'rounded-l'} ${view === key ? 'bg-cost text-paper-raised' : 'bg-paper-raised text-ink hover:bg-paper-sunk'}`}
              >
                {label}
              </button>
            ))}
          </div>
          <a className={buttonClass('secondary')} href={download.csv} download>
            Download CSV
          </a>
          <a className={buttonClass('secondary')} href={download.xlsx} download>
            Download XLSX
          </a>
        </div>
      </div>
      <table className="w-full border-collapse text-sm" data-testid="allocation-table">
        <TableHead
          look="captioned"
          cells={[
            { title: 'Code', className: 'pr-3' },
            'Name',
            { title: 'Kind', className: 'pl-3' },
            { title: `Allocated at ${table.level}`, align: 'right', className: 'pl-3' },
            { title: 'Share', align: 'right', className: 'pl-3' },
          ]}
        />
        <tbody>
          {rows.map((r) => (
            <tr key={`${r.kind}-${r.code}`} className="border-b border-rule/60" data-testid="allocation-row">
              <td className="py-0.5 pr-3 font-mono text-xs">{r.code}</td>
              <td className="py-0.5">{r.name}</td>
              <td className="py-0.5 pl-3 text-ink-soft">
                {view === 'wbs'
                  ? r.kind === 'item'
                    ? 'WBS branch'
                    : 'risks'
                  : r.kind === 'item'
                    ? 'line item'
                    : 'risk'}
              </td>
              <td className={cell} data-testid="allocation-amount">
                {money(r.amount)}
              </td>
              <td className={`${cell} text-ink-soft`}>{pct(r.share)}</td>
            </tr>
          ))}
          {others ? (
            <tr className="border-b border-rule/60 italic" data-testid="allocation-row">
              <td className="py-0.5 pr-3" />
              <td className="py-0.5">{others.name} (in the downloads line by line)</td>
              <td className="py-0.5 pl-3" />
              <td className={cell} data-testid="allocation-amount">
                {money(others.amount)}
              </td>
              <td className={`${cell} text-ink-soft`}>{pct(others.share)}</td>
            </tr>
          ) : null}
        </tbody>
        <tfoot>
          <tr className="border-t-2 border-rule font-semibold">
            <td className="pt-1" colSpan={3}>
              Sum of the rows
            </td>
            <td className={cell} data-testid="allocation-sum">
              {money(table.sum)}
            </td>
            <td className={`${cell} text-ink-soft`}>
              {pct(table.contingency ? table.sum / table.contingency : null)}
            </td>
          </tr>
          <tr>
            <td className="py-0.5" colSpan={3}>
              Contingency at {table.level} ({table.level} less the base)
            </td>
            <td className={cell} data-testid="allocation-contingency">
              {money(table.contingency)}
            </td>
            <td className={`${cell} text-ink-soft`}>{pct(table.contingency ? 1 : null)}</td>
          </tr>
          <tr className="text-ink-soft">
            <td className="py-0.5" colSpan={3}>
              Monte Carlo difference: the iterations&apos; mean total less the {table.level} itself
            </td>
            <td className={cell} data-testid="allocation-difference">
              {money(table.difference)}
            </td>
            <td className={cell}>{pct(table.contingency ? table.difference / table.contingency : null)}</td>
          </tr>
        </tfoot>
      </table>
    </div>
  );
}
