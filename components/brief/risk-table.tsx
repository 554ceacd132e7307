import { formatDays, formatMoney } from '@/lib/runs/format';
import type { RiskExposure } from '@/lib/brief/risk-exposure';
import { probabilityText } from '@/lib/brief/format';
import { TableHead, type HeadCell } from '@/components/ui/table';

const HEAD: HeadCell[] = [
  'Risk event',
  ...['Probability', 'Mean cost if it occurs', 'Mean delay', 'Expected cost'].map((title) => ({
    title,
    align: 'num' as const,
  })),
];

/** The run's risk events with the largest expected cost (probability × mean cost impact). */
export function RiskTable({ risks, currency }: { risks: RiskExposure[]; currency: string }) {
  if (!risks.length) return <p className="text-sm text-ink-faint">The run had no risk events.</p>;
  return (
    <table className="w-full text-sm">
      <TableHead look="ruled" cells={HEAD} />
      <tbody>
        {risks.map((r) => (
          <tr key={r.id} className="border-b border-rule break-inside-avoid">
            <td className="py-1">
              <span className="text-ink-faint">{r.id}</span> {r.name === r.id ? '' : r.name}
            </td>
            <td className="num py-1">{probabilityText(r.probability)}</td>
            <td className="num py-1">{formatMoney(r.meanCost, currency)}</td>
            <td className="num py-1 text-ink-soft">{r.meanDelay === null ? '—' : formatDays(r.meanDelay)}</td>
            <td className="num py-1 font-medium">{formatMoney(r.expectedCost, currency)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
