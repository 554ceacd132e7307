import Link from 'next/link';
import { listBaselines } from '@/lib/services/approvals';
import { formatMoney } from '@/lib/runs/format';
import { dateText } from '@/lib/brief/format';
import { Card, EmptyState } from '@/components/ui/card';
import { ResultCautions } from '@/components/ui/notice';
import { TrendCharts } from '@/components/brief/trend-chart';
import { TrendTable } from '@/components/brief/trend-table';
import { loadProjectPage } from '../project-page';

export default async function TrendPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { actor, project } = await loadProjectPage(params, 'trend');
  const rows = await listBaselines(actor, project.id);
  const current = rows[rows.length - 1];
  return (
    <div className="space-y-4">
      <header className="flex items-end justify-between">
        {/* The project's name and code are in the workspace header above. */}
        <h2 className="text-xl font-semibold">Trend of approved baselines</h2>
        <Link className="text-sm text-cost underline" href={`/projects/${project.id}/decisions`}>
          Every decision
        </Link>
      </header>
      {!current ? (
        <EmptyState title="No approved baseline yet">
          Start a run, open its brief and send it to the sponsors: once a sponsor approves it, it appears
          here.
        </EmptyState>
      ) : (
        <>
          <p data-testid="current-baseline">
            Current baseline: <strong>run {current.runNumber}</strong>, approved {dateText(current.decidedAt)}{' '}
            by {current.sponsorName}
            {current.selfApproved ? ' (self-approved)' : ''} at {current.stage}, {current.scenario}
            -mitigation: P80 <strong>{formatMoney(current.p80, project.currency)}</strong>, base{' '}
            {formatMoney(current.base, project.currency)}.
          </p>
          <TrendCharts rows={rows} currency={project.currency} />
          <Card title="Figures">
            <TrendTable rows={rows} currency={project.currency} projectId={project.id} />
          </Card>
          <ResultCautions />
        </>
      )}
    </div>
  );
}
