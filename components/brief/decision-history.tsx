import Link from 'next/link';
import type { DecisionView } from '@/lib/view-types/approvals';
import { dateTimeText } from '@/lib/brief/format';

/** Every decision on the project's runs, newest first, as recorded (never edited). */
export function DecisionHistory({ decisions, projectId }: { decisions: DecisionView[]; projectId: number }) {
  return (
    <table className="w-full text-sm" data-testid="decision-history">
      <thead>
        <tr className="border-b border-rule text-xs text-ink-soft">
          <th className="py-1 text-left font-medium">When</th>
          <th className="py-1 text-left font-medium">Run</th>
          <th className="py-1 text-left font-medium">Decision</th>
          <th className="py-1 text-left font-medium">By</th>
          <th className="py-1 text-left font-medium">Stage</th>
          <th className="py-1 text-left font-medium">Comment</th>
        </tr>
      </thead>
      <tbody>
        {decisions.map((d) => (
          <tr key={d.id} className="border-b border-rule align-top">
            <td className="py-1 whitespace-nowrap">{dateTimeText(d.decidedAt)}</td>
            <td className="py-1">
              <Link className="text-cost underline" href={`/projects/${projectId}/runs/${d.runId}/brief`}>
                Run {d.runId}
              </Link>
            </td>
            <td
              className={`py-1 font-medium ${d.decision === 'approved' ? 'text-cost-dark' : 'text-caution-dark'}`}
            >
              {d.decision === 'approved' ? 'Approved' : 'Returned'}
            </td>
            <td className="py-1">{d.sponsorName}</td>
            <td className="py-1">
              {d.stage} · C{d.estimateClass}
            </td>
            <td className="py-1 whitespace-pre-line text-ink-soft">{d.comment || '—'}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
