import type { DecisionBrief } from '@/lib/brief/build';
import { dateTimeText } from '@/lib/brief/format';

/** A recorded decision: what, who, when, and the comment. It is never edited. */
export function DecisionRecord({ decision }: { decision: DecisionBrief }) {
  const approved = decision.decision === 'approved';
  return (
    <div
      className={`rounded border px-3 py-2 text-sm ${approved ? 'border-cost/40 bg-cost-light text-cost-dark' : 'border-caution/50 bg-caution-light text-caution-dark'}`}
      data-testid="decision-record"
    >
      <p className="font-semibold">
        {approved ? 'Approved as the baseline' : 'Returned for rework'} by {decision.sponsorName}
        {decision.selfApproved ? (
          <span
            className="ml-2 rounded border border-caution/60 bg-caution-light px-1.5 py-0.5 text-2xs font-semibold uppercase tracking-wide text-caution-dark"
            data-testid="self-approved"
            title="The sponsor also started this run; the organisation allows self-approval."
          >
            Self-approved
          </span>
        ) : null}
      </p>
      <p className="text-xs">
        {dateTimeText(decision.decidedAt)} · {decision.stage} · Class {decision.estimateClass}
      </p>
      {decision.comment ? <p className="mt-1 whitespace-pre-line">“{decision.comment}”</p> : null}
    </div>
  );
}
