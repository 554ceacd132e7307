import { formatMoney, formatShare } from '@/lib/runs/format';
import type { AllocationBrief } from '@/lib/brief/allocation';

/** Where the contingency sits: the run's allocation summed by top-level WBS, adding up on screen. */
export function AllocationTable({ allocation, currency }: { allocation: AllocationBrief; currency: string }) {
  const money = (v: number) => formatMoney(v, currency);
  const gap = allocation.contingency - allocation.total;
  return (
    <div className="space-y-1">
      <table className="w-full text-sm break-inside-avoid" data-testid="allocation-table">
        <thead>
          <tr className="border-b border-rule text-xs text-ink-soft">
            <th className="py-1 text-left font-medium">Top-level WBS</th>
            <th className="num py-1 font-medium">Lines</th>
            <th className="num py-1 font-medium">Contingency at {allocation.level}</th>
            <th className="num py-1 font-medium">Share</th>
          </tr>
        </thead>
        <tbody>
          {allocation.rows.map((r) => (
            <tr key={r.wbs ?? 'risks'} className="border-b border-rule">
              <td className="py-1">
                {r.wbs !== null && r.name !== `WBS ${r.wbs}` ? (
                  <span className="text-ink-faint">{r.wbs} </span>
                ) : null}
                {r.name}
              </td>
              <td className="num py-1 text-ink-soft">{r.count}</td>
              <td className="num py-1">{money(r.amount)}</td>
              <td className="num py-1 text-ink-soft">{r.share === null ? '—' : formatShare(r.share, 0)}</td>
            </tr>
          ))}
          <tr className="font-semibold">
            <td className="py-1">Total</td>
            <td className="py-1" />
            <td className="num py-1" data-testid="allocation-total">
              {money(allocation.total)}
            </td>
            <td className="num py-1 text-ink-soft">
              {allocation.contingency ? formatShare(allocation.total / allocation.contingency, 0) : '—'}
            </td>
          </tr>
        </tbody>
      </table>
      <p className="text-xs text-ink-faint">
        Each line&apos;s mean cost over base in the simulated outcomes nearest the {allocation.level} total
        (Euler allocation); a risk that names line items counts in their branch. The contingency at{' '}
        {allocation.level} is {money(allocation.contingency)}
        {Math.abs(gap) >= 0.5
          ? `; the rows differ from it by ${money(Math.abs(gap))}, which is Monte Carlo error`
          : ''}
        .
      </p>
    </div>
  );
}
