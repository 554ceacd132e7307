import Link from 'next/link';
import { formatMoney } from '@/lib/runs/format';
import { dateText } from '@/lib/brief/format';
import type { TrendRow } from '@/lib/brief/trend';

/** The figures behind the trend chart, one row per approved baseline. */
export function TrendTable({
  rows,
  currency,
  projectId,
}: {
  rows: TrendRow[];
  currency: string;
  projectId: number;
}) {
  const m = (v: number) => formatMoney(v, currency);
  return (
    <table className="w-full text-xs" data-testid="trend-table">
      <thead>
        <tr className="border-b border-rule text-xs text-ink-soft">
          <th className="py-1 text-left font-medium">Approved</th>
          <th className="py-1 text-left font-medium">Stage</th>
          <th className="num whitespace-nowrap py-1 font-medium">Base</th>
          <th className="num whitespace-nowrap py-1 font-medium">P50</th>
          <th className="num whitespace-nowrap py-1 font-medium">P80</th>
          <th className="num whitespace-nowrap py-1 font-medium">Contingency (P80)</th>
          <th className="num whitespace-nowrap py-1 font-medium">Change</th>
        </tr>
      </thead>
      <tbody>
        {rows.map((r) => (
          <tr key={r.approvalId} className="border-b border-rule">
            <td className="py-1">
              <Link className="text-cost underline" href={`/projects/${projectId}/runs/${r.runId}/brief`}>
                {dateText(r.decidedAt)}
              </Link>
              <span className="block text-2xs text-ink-faint">
                run {r.runId} · {r.sponsorName}
              </span>
            </td>
            <td className="py-1">
              {r.stage} <span className="text-ink-faint">· C{r.estimateClass}</span>
            </td>
            <td className="num whitespace-nowrap py-1">{m(r.base)}</td>
            <td className="num whitespace-nowrap py-1">{m(r.p50)}</td>
            <td className="num whitespace-nowrap py-1 font-medium">{m(r.p80)}</td>
            <td className="num whitespace-nowrap py-1">{m(r.contingencyP80)}</td>
            <td className="num whitespace-nowrap py-1 text-ink-soft">
              {r.contingencyChange === null
                ? '—'
                : `${r.contingencyChange > 0 ? '+' : r.contingencyChange < 0 ? '−' : '±'}${m(Math.abs(r.contingencyChange))}`}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
