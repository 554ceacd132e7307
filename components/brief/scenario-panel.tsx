import type { BriefData } from '@/lib/brief/build';
import { responsesText, SCENARIO_TEXT, scenarioRows } from '@/lib/brief/wording';

/**
 * Whether the figures are before or after the planned responses, what the responses cost, and,
 * when the run carries both scenarios, what they buy at P50 and P80.
 */
export function ScenarioPanel({ brief }: { brief: BriefData }) {
  const { scenario } = brief;
  const rows = scenarioRows(scenario, brief.project.currency);
  return (
    <div className="space-y-2 text-sm" data-testid="scenario">
      <p>
        <strong>{SCENARIO_TEXT[scenario.used].title}.</strong> {SCENARIO_TEXT[scenario.used].detail}{' '}
        {responsesText(scenario, brief.project.currency)}
      </p>
      {rows.length ? (
        <table className="w-full text-sm break-inside-avoid" data-testid="scenario-table">
          <thead>
            <tr className="border-b border-rule text-xs text-ink-soft">
              <th className="py-1 text-left font-medium">Same run, same random numbers</th>
              <th className="num py-1 font-medium">Before responses</th>
              <th className="num py-1 font-medium">After responses</th>
              <th className="num py-1 font-medium">What the responses buy</th>
            </tr>
          </thead>
          <tbody>
            {rows.map(([label, pre, post, buys]) => (
              <tr key={label} className="border-b border-rule">
                <td className="py-1">{label}</td>
                <td className="num py-1">{pre}</td>
                <td className="num py-1">{post}</td>
                <td className="num py-1 font-medium">{buys}</td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
    </div>
  );
}
