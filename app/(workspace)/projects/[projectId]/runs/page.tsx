import { randomInt } from 'node:crypto';
import { can } from '@/lib/auth/roles';
import { listRuns } from '@/lib/services/runs';
import { exportModelFile } from '@/lib/services/model-file';
import { scheduleHealthOfModel } from '@/lib/services/schedule-health';
import { MAX_SEED } from '@/lib/validation/runs';
import { Card } from '@/components/ui/card';
import { ModelNotices } from '@/components/runs/model-notices';
import { RunSettingsForm } from '@/components/runs/run-settings-form';
import { RunsHistory } from '@/components/runs/runs-history';
import { loadProjectPage } from '../project-page';

export const metadata = { title: 'Runs' };

export default async function RunsPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { actor, project } = await loadProjectPage(params, 'runs', 'run:read');
  const mayStart = can(actor.role, 'run:start');
  const [runs, model] = await Promise.all([
    listRuns(actor, project.id),
    mayStart ? exportModelFile(actor, project.id) : null,
  ]);
  const health = model ? scheduleHealthOfModel(model.model) : null;
  return (
    <div className="space-y-5">
      <h1 className="text-xl font-semibold">Runs</h1>
      {mayStart ? (
        <Card title="Start a run">
          {model?.notices.length ? (
            <div className="mb-3">
              <ModelNotices notices={model.notices} title="The next run's model follows the status rules" />
            </div>
          ) : null}
          <RunSettingsForm
            projectId={project.id}
            initialSeed={randomInt(1, MAX_SEED + 1)}
            baseDate={project.baseDate}
            currency={project.currency}
            health={health}
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
