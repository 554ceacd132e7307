import { randomInt } from 'node:crypto';
import { can } from '@/lib/auth/roles';
import { listRuns } from '@/lib/services/runs';
import { MAX_SEED } from '@/lib/validation/runs';
import { Card } from '@/components/ui/card';
import { RunSettingsForm } from '@/components/runs/run-settings-form';
import { RunsHistory } from '@/components/runs/runs-history';
import { loadProjectPage } from '../project-page';

export const metadata = { title: 'Runs' };

export default async function RunsPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { actor, project } = await loadProjectPage(params, 'runs', 'run:read');
  const runs = await listRuns(actor, project.id);
  const mayStart = can(actor.role, 'run:start');
  return (
    <div className="space-y-5">
      <h1 className="text-xl font-semibold">Runs</h1>
      {mayStart ? (
        <Card title="Start a run">
          <RunSettingsForm
            projectId={project.id}
            initialSeed={randomInt(1, MAX_SEED + 1)}
            baseDate={project.baseDate}
            currency={project.currency}
            targets={{ cost: project.costTarget, finish: project.finishTarget }}
          />
        </Card>
      ) : (
        <p className="text-sm text-ink-soft">
          Estimators and owners start runs; you can read every run below.
        </p>
      )}
      <RunsHistory projectId={project.id} currency={project.currency} initial={runs} mayStart={mayStart} />
    </div>
  );
}
