import type { AchievedCorrelation } from '@/lib/sim';

/** Target, used (after any repair) and achieved rank correlation of each pair. */
export function CorrelationsTable({
  rows,
  nameOf,
}: {
  rows: AchievedCorrelation[];
  nameOf: (id: string) => string;
}) {
  if (rows.length === 0)
    return <p className="text-sm text-ink-soft">No correlations were entered for this run.</p>;
  const repaired = rows.filter((r) => Math.abs(r.used - r.target) > 5e-4);
  return (
    <div className="space-y-2">
      {repaired.length ? (
        <p className="text-sm text-caution-dark">
          The coefficients entered did not form a valid correlation matrix, so they were moved to the nearest
          valid set: {repaired.length} pair{repaired.length > 1 ? 's' : ''} changed (column “Used”).
        </p>
      ) : (
        <p className="text-sm text-ink-soft">
          The coefficients entered formed a valid set; none needed repair.
        </p>
      )}
      <table className="w-full border-collapse text-sm">
        <thead className="text-xs text-ink-soft">
          <tr className="border-b border-rule">
            <th className="py-1 pr-2 text-left font-medium">Pair</th>
            <th className="py-1 pr-2 text-right font-medium">Target</th>
            <th className="py-1 pr-2 text-right font-medium">Used</th>
            <th className="py-1 pr-2 text-right font-medium">Moved by</th>
            <th className="py-1 text-right font-medium">Achieved</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={`${r.a}-${r.b}`} className="border-b border-rule/60">
              <td className="py-0.5 pr-2">
                {r.a} ↔ {r.b}
                <span className="ml-1 text-xs text-ink-faint">
                  {nameOf(r.a)} · {nameOf(r.b)}
                </span>
              </td>
              <td className="num py-0.5 pr-2">{r.target.toFixed(2)}</td>
              <td className="num py-0.5 pr-2">{r.used.toFixed(2)}</td>
              <td className="num py-0.5 pr-2">
                {Math.abs(r.used - r.target) < 5e-4 ? '0' : (r.used - r.target).toFixed(3)}
              </td>
              <td className="num py-0.5">
                {r.achieved === null ? <span title="One side has no spread">—</span> : r.achieved.toFixed(2)}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
