import { formatDays, formatMoney } from '@/lib/runs/format';
import type { BriefData } from '@/lib/brief/build';
import { SCENARIO_TEXT } from '@/lib/brief/wording';

/**
 * Whether the figures are before or after the planned responses, what the responses cost, and,
 * when the run carries both scenarios, what they buy at P50 and P80.
 */
export function ScenarioPanel({ brief }: { brief: BriefData }) {
  const { scenario } = brief;
  const money = (v: number) => formatMoney(v, brief.project.currency);
  const c = scenario.compared;
  return (
    <div className="space-y-2 text-sm" data-testid="scenario">
      <p>
        <strong>{SCENARIO_TEXT[scenario.used].title}.</strong> {SCENARIO_TEXT[scenario.used].detail}{' '}
        {scenario.responses
          ? `The ${scenario.responses.count} response${scenario.responses.count === 1 ? '' : 's'} with a cost are expected to cost ${money(scenario.responses.expectedCost)} in total${scenario.used === 'post' ? ', included in the figures' : ', not included in these figures'}.`
          : 'No response cost was entered.'}
      </p>
      {c ? (
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
            {(
              [
                ['Cost P50', c.pre.costP50, c.post.costP50, money],
                ['Cost P80', c.pre.costP80, c.post.costP80, money],
                ['Duration P50', c.pre.durationP50, c.post.durationP50, (v: number) => formatDays(v)],
                ['Duration P80', c.pre.durationP80, c.post.durationP80, (v: number) => formatDays(v)],
              ] as const
            )
              .filter((r) => r[1] !== null && r[2] !== null)
              .map(([label, pre, post, show]) => (
                <tr key={label} className="border-b border-rule">
                  <td className="py-1">{label}</td>
                  <td className="num py-1">{show(pre!)}</td>
                  <td className="num py-1">{show(post!)}</td>
                  <td className="num py-1 font-medium">
                    {pre! - post! >= 0 ? `${show(pre! - post!)} less` : `${show(post! - pre!)} more`}
                  </td>
                </tr>
              ))}
          </tbody>
        </table>
      ) : null}
    </div>
  );
}
