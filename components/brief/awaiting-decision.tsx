import type { AwaitingBrief } from '@/lib/view-types/approvals';
import { dateTimeText } from '@/lib/brief/format';
import { Card } from '@/components/ui/card';
import { BriefLink } from './brief-link';

/** The briefs that wait for a decision, first on the page of those who decide. */
export function AwaitingDecision({ briefs }: { briefs: AwaitingBrief[] }) {
  return (
    <Card title="Briefs waiting for your decision">
      {briefs.length === 0 ? (
        <p className="text-sm text-ink-soft" data-testid="awaiting-none">
          Nothing waits for your decision. When an estimator sends a brief, it is listed here and you get an
          e-mail.
        </p>
      ) : (
        <ul className="divide-y divide-rule text-sm" data-testid="awaiting-decision">
          {briefs.map((b) => (
            <li key={b.runId} className="flex flex-wrap items-baseline gap-x-3 py-1.5 first:pt-0 last:pb-0">
              <BriefLink projectId={b.projectId} runId={b.runId}>
                {b.projectCode} · brief of run {b.runId}
              </BriefLink>
              <span>{b.projectName}</span>
              <span className="text-xs text-ink-faint">
                sent by {b.sentByName}, {dateTimeText(b.sentAt)}
                {b.startedByYou ? ' · you started this run' : ''}
              </span>
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}
