import { formatDays, formatMoney } from '@/lib/runs/format';
import type { RiskExposure } from '@/lib/brief/risk-exposure';
import { probabilityText } from '@/lib/brief/format';

/** The run's risk events with the largest expected cost (probability × mean cost impact). */
export function RiskTable({ risks, currency }: { risks: RiskExposure[]; currency: string }) {
  if (!risks.length) return <p className="text-sm text-ink-faint">The run had no risk events.</p>;
  return (
    <table className="w-full text-sm">
      <thead>
        <tr className="border-b border-rule text-xs text-ink-soft">
          <th className="py-1 text-left font-medium">Risk event</th>
          <th className="num py-1 font-medium">Probability</th>
          <th className="num py-1 font-medium">Mean cost if it occurs</th>
          <th className="num py-1 font-medium">Mean delay</th>
          <th className="num py-1 font-medium">Expected cost</th>
        </tr>
      </thead>
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
