import { BriefLink } from './brief-link';
import { formatChange, formatDays, formatMoney } from '@/lib/runs/format';
import { dateText } from '@/lib/brief/format';
import type { TrendRow } from '@/lib/brief/trend';
import { Table, type HeadCell } from '@/components/ui/table';

const num = (title: string): HeadCell => ({ title, align: 'num', className: 'whitespace-nowrap' });
const HEAD: HeadCell[] = [
  'Approved',
  'Stage',
  'Scenario',
  ...['P50', 'P80', 'Contingency (P80)', 'Change', 'Schedule margin (P80)', 'Change'].map(num),
];

/**
 * The figures behind the trend charts, one row per approved baseline. A change is measured from
 * the previous baseline of the same scenario, never across pre- and post-mitigation.
 */
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
  const d = (v: number) => formatDays(v);
  return (
    <Table look="ruled" head={HEAD} className="w-full text-xs" data-testid="trend-table">
      {rows.map((r) => (
        <tr key={r.approvalId} className="border-b border-rule" data-testid={`trend-row-${r.runId}`}>
          <td className="py-1">
            <BriefLink projectId={projectId} runId={r.runId}>
              {dateText(r.decidedAt)}
            </BriefLink>
            <span className="block text-2xs text-ink-faint">
              run {r.runNumber} · {r.sponsorName}
            </span>
            {r.selfApproved ? (
              <span
                className="block text-2xs font-semibold text-caution-dark"
                data-testid="trend-self-approved"
              >
                self-approved
              </span>
            ) : null}
          </td>
          <td className="py-1">
            {r.stage} <span className="text-ink-faint">· C{r.estimateClass}</span>
          </td>
          <td className="py-1">{r.scenario === 'post' ? 'post-mitigation' : 'pre-mitigation'}</td>
          <td className="num whitespace-nowrap py-1">{m(r.p50)}</td>
          <td className="num whitespace-nowrap py-1 font-medium">{m(r.p80)}</td>
          <td className="num whitespace-nowrap py-1">{m(r.contingencyP80)}</td>
          <td className="num whitespace-nowrap py-1 text-ink-soft">
            {r.contingencyChange === null ? '—' : formatChange(r.contingencyChange, m)}
          </td>
          <td className="num whitespace-nowrap py-1">
            {r.scheduleMarginP80 === null ? '—' : d(r.scheduleMarginP80)}
          </td>
          <td className="num whitespace-nowrap py-1 text-ink-soft">
            {r.scheduleMarginChange === null ? '—' : formatChange(r.scheduleMarginChange, d)}
          </td>
        </tr>
      ))}
    </Table>
  );
}
