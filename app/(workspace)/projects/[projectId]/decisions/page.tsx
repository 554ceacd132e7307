import Link from 'next/link';
import { listDecisions } from '@/lib/services/approvals';
import { dateText } from '@/lib/brief/format';
import { Card, EmptyState } from '@/components/ui/card';
import { DecisionHistory } from '@/components/brief/decision-history';
import { loadProjectPage } from '../project-page';

export default async function DecisionsPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { actor, project } = await loadProjectPage(params, 'decisions');
  const decisions = await listDecisions(actor, project.id);
  const baseline = decisions.find((d) => d.decision === 'approved');
  return (
    <div className="space-y-4">
      <header className="flex items-end justify-between">
        {/* The project's name and code are in the workspace header above. */}
        <h2 className="text-xl font-semibold">Decisions</h2>
        <Link className="text-sm text-cost underline" href={`/projects/${project.id}/trend`}>
          Trend
        </Link>
      </header>
      <p data-testid="current-baseline">
        {baseline ? (
          <>
            Current baseline:{' '}
            <Link
              className="text-cost underline"
              href={`/projects/${project.id}/runs/${baseline.runId}/brief`}
            >
              run {baseline.runNumber}
            </Link>
            , approved {dateText(baseline.decidedAt)} by {baseline.sponsorName} ({baseline.stage}).
          </>
        ) : (
          'No run has been approved as the baseline yet.'
        )}
      </p>
      {decisions.length ? (
        <Card title="History">
          <DecisionHistory decisions={decisions} projectId={project.id} />
        </Card>
      ) : (
        <EmptyState title="No decisions yet">
          A sponsor decides from a run&apos;s brief: approve it as the baseline, or return it with a comment.
        </EmptyState>
      )}
    </div>
  );
}
