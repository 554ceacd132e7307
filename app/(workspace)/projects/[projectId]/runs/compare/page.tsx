import Link from 'next/link';
import { compareRuns } from '@/lib/services/runs';
import { EmptyState } from '@/components/ui/card';
import { CompareView } from '@/components/runs/compare-view';
import { isAppError } from '@/lib/errors';
import { idParam } from '@/lib/http/params';
import { loadOrNotFound } from '@/lib/http/page';
import { loadProjectPage } from '../../project-page';

export const metadata = { title: 'Compare runs' };

export default async function CompareRunsPage({
  params,
  searchParams,
}: {
  params: Promise<{ projectId: string }>;
  searchParams: Promise<{ a?: string; b?: string }>;
}) {
  const { a, b } = await searchParams;
  const { actor, project } = await loadProjectPage(params, 'runs/compare', 'run:read');
  const back = (
    <Link href={`/projects/${project.id}/runs`} className="text-cost hover:underline">
      Back to the runs
    </Link>
  );
  if (!a || !b || a === b) {
    return (
      <EmptyState title="Choose two runs to compare">
        Tick two finished runs in the list of runs, then press Compare selected. {back}
      </EmptyState>
    );
  }
  let comparison;
  try {
    comparison = await loadOrNotFound(() =>
      compareRuns(actor, project.id, idParam(a, 'Run'), idParam(b, 'Run')),
    );
  } catch (e) {
    if (isAppError(e) && e.status === 409) {
      return (
        <EmptyState title="Only finished runs can be compared">
          {e.message} {back}
        </EmptyState>
      );
    }
    throw e;
  }
  return (
    <div className="space-y-5">
      <div className="flex items-end">
        <h1 className="text-xl font-semibold">
          Run {comparison.a.run.number} and run {comparison.b.run.number}
        </h1>
        <span className="ml-auto">{back}</span>
      </div>
      <CompareView
        project={project}
        a={{ run: comparison.a.run, result: comparison.a.result }}
        b={{ run: comparison.b.run, result: comparison.b.result }}
        diff={comparison.diff}
      />
    </div>
  );
}
