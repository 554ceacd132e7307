import { BriefLink } from './brief-link';
import type { DecisionView } from '@/lib/view-types/approvals';
import { dateTimeText } from '@/lib/brief/format';
import { Table, type HeadCell } from '@/components/ui/table';

const HEAD: HeadCell[] = ['When', 'Run', 'Decision', 'By', 'Stage', 'Comment'];

/** Every decision on the project's runs, newest first, as recorded (never edited). */
export function DecisionHistory({ decisions, projectId }: { decisions: DecisionView[]; projectId: number }) {
  return (
    <Table look="ruled" head={HEAD} className="w-full text-sm" data-testid="decision-history">
      {decisions.map((d) => (
        <tr key={d.id} className="border-b border-rule align-top">
          <td className="py-1 whitespace-nowrap">{dateTimeText(d.decidedAt)}</td>
          <td className="py-1">
            <BriefLink projectId={projectId} runId={d.runId}>
              Run {d.runNumber}
            </BriefLink>
          </td>
          <td
            className={`py-1 font-medium ${d.decision === 'approved' ? 'text-cost-dark' : 'text-caution-dark'}`}
          >
            {d.decision === 'approved' ? 'Approved' : 'Returned'}
            {d.selfApproved ? (
              <span className="block text-2xs font-semibold uppercase text-caution-dark">self-approved</span>
            ) : null}
          </td>
          <td className="py-1">{d.sponsorName}</td>
          <td className="py-1">
            {d.stage} · C{d.estimateClass}
          </td>
          <td className="py-1 whitespace-pre-line text-ink-soft">{d.comment || '—'}</td>
        </tr>
      ))}
    </Table>
  );
}
