import { BriefLink } from './brief-link';
import { formatMoney } from '@/lib/runs/format';
import { dateText } from '@/lib/brief/format';
import type { TrendRow } from '@/lib/brief/trend';
import { Table, type HeadCell } from '@/components/ui/table';

const num = (title: string): HeadCell => ({ title, align: 'num', className: 'whitespace-nowrap' });
const HEAD: HeadCell[] = [
  'Approved',
  'Stage',
  ...['Base', 'P50', 'P80', 'Contingency (P80)', 'Change'].map(num),
];

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
    <Table look="ruled" head={HEAD} className="w-full text-xs" data-testid="trend-table">
      {rows.map((r) => (
        <tr key={r.approvalId} className="border-b border-rule">
          <td className="py-1">
            <BriefLink projectId={projectId} runId={r.runId}>
              {dateText(r.decidedAt)}
            </BriefLink>
            <span className="block text-2xs text-ink-faint">
              run {r.runNumber} · {r.sponsorName}
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
    </Table>
  );
}
