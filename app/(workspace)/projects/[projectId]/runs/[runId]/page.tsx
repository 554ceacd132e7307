import Link from 'next/link';
import { can } from '@/lib/auth/roles';
import { getRunOutcome } from '@/lib/services/runs';
import { inputNames, sampleCharts } from '@/lib/runs/outcome-data';
import { buttonClass } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { OutcomeView } from '@/components/runs/outcome-view';
import { RunProgress } from '@/components/runs/run-progress';
import { ModelNotices } from '@/components/runs/model-notices';
import { RunStatusBadge } from '@/components/runs/run-status';
import { settingsText } from '@/components/runs/settings-text';
import { formatCount, formatDateTime } from '@/lib/format';
import { loadRunPage, type RunParams } from './run-page';

export const metadata = { title: 'Run outcome' };

export default async function RunPage({ params }: { params: RunParams }) {
  const { actor, project, run } = await loadRunPage(params, '', 'run:read');
  const outcome = run.status === 'succeeded' ? await getRunOutcome(actor, project.id, run.id) : null;
  return (
    <div className="space-y-5">
      <div className="flex items-end gap-4">
        <div className="space-y-0.5">
          <h1 className="flex items-center gap-3 text-xl font-semibold">
            Run {run.number} <RunStatusBadge status={run.status} />
          </h1>
          <p className="text-sm text-ink-soft">
            {settingsText(run.settings)}
            {outcome && run.settings.precision
              ? ` · stopped at ${formatCount(outcome.result.iterations)} iterations`
              : ''}
          </p>
          <p className="text-xs text-ink-faint">
            Started by {run.startedBy?.name ?? 'a former member'} on {formatDateTime(run.createdAt)} · input{' '}
            <span className="font-mono" title={run.inputHash}>
              {run.inputHash.slice(0, 12)}
            </span>
          </p>
        </div>
        <div className="ml-auto flex gap-2">
          {run.status === 'succeeded' ? (
            <Link
              href={`/projects/${project.id}/runs/${run.id}/brief`}
              className={buttonClass('primary')}
              data-testid="open-brief"
            >
              Open the brief for sponsors
            </Link>
          ) : null}
          <a
            href={`/api/projects/${project.id}/runs/${run.id}/snapshot`}
            className={buttonClass('secondary')}
            download
          >
            Download model file
          </a>
          <Link href={`/projects/${project.id}/runs`} className={buttonClass('ghost')}>
            All runs
          </Link>
        </div>
      </div>
      {run.engine.notice ? (
        <Notice tone="caution" title="Made by another engine">
          {run.engine.notice} The figures below are the ones stored when the run finished.
        </Notice>
      ) : null}
      <ModelNotices notices={run.modelNotices} title="The status rules changed this run's model" />
      {outcome ? (
        <OutcomeView
          project={project}
          run={outcome.run}
          result={outcome.result}
          charts={outcome.sample ? sampleCharts(outcome.sample) : null}
          names={inputNames(outcome.snapshot)}
        />
      ) : (
        <RunProgress initial={run} mayCancel={can(actor.role, 'run:cancel')} />
      )}
    </div>
  );
}
