import Link from 'next/link';
import { redirect } from 'next/navigation';
import { requirePageActor } from '@/lib/auth/guard';
import { can } from '@/lib/auth/roles';
import { landingPath } from '@/lib/auth/landing';
import { briefsAwaitingDecision } from '@/lib/services/brief';
import { AwaitingDecision } from '@/components/brief/awaiting-decision';
import { listProjectsWithEstimates } from '@/lib/services/projects';
import { latestRunSummaries } from '@/lib/services/runs';
import { formatMoney } from '@/lib/format';
import { Card, EmptyState } from '@/components/ui/card';
import { ProjectActions } from '@/components/projects/project-actions';
import { StartProject } from '@/components/projects/start-project';

export const metadata = { title: 'Projects' };

export default async function ProjectsPage({
  searchParams,
}: {
  searchParams: Promise<{ archived?: string }>;
}) {
  const actor = await requirePageActor(undefined, '/projects');
  // The workspace's front door: a role that reads no projects starts on its own page instead.
  if (!can(actor.role, 'project:read')) redirect(landingPath(actor.role));
  const showArchived = (await searchParams).archived === '1';
  const projects = await listProjectsWithEstimates(actor, { includeArchived: showArchived });
  const latest = await latestRunSummaries(
    actor,
    projects.map((p) => p.id),
  );
  const mayWrite = can(actor.role, 'project:write');
  const awaiting = await briefsAwaitingDecision(actor);
  // Those who decide without preparing (sponsors) come to decide: the list comes first, even empty.
  const showAwaiting = can(actor.role, 'baseline:decide') && (awaiting.length > 0 || !mayWrite);
  return (
    <div className="space-y-5">
      {showAwaiting ? <AwaitingDecision briefs={awaiting} /> : null}
      <div className="flex items-baseline justify-between">
        <h1 className="text-2xl font-semibold">Projects</h1>
        <Link
          href={showArchived ? '/projects' : '/projects?archived=1'}
          className="text-sm text-cost hover:underline"
        >
          {showArchived ? 'Hide archived' : 'Show archived'}
        </Link>
      </div>
      {projects.length === 0 ? (
        <EmptyState title="No projects yet">
          {mayWrite
            ? 'Start a blank project and build its registers in the grids, or start from a model file or an XLSX workbook.'
            : 'An estimator or owner creates the projects you will read here.'}
        </EmptyState>
      ) : (
        <table
          className="w-full border-collapse rounded border border-rule bg-paper-raised text-sm"
          aria-label="Projects"
        >
          <thead className="bg-paper-sunk text-left text-xs uppercase tracking-wide text-ink-soft">
            <tr>
              <th className="px-3 py-2">Code</th>
              <th className="px-3 py-2">Name</th>
              <th className="px-3 py-2">Stage</th>
              <th className="px-3 py-2">Class</th>
              <th className="px-3 py-2">Currency</th>
              <th className="px-3 py-2 text-right">Base estimate</th>
              <th className="px-3 py-2 text-right" title="Latest completed run: P50 and P80 of cost">
                Latest P50 / P80
              </th>
              {mayWrite ? <th className="px-3 py-2" /> : null}
            </tr>
          </thead>
          <tbody>
            {projects.map((p) => (
              <tr
                key={p.id}
                className="border-t border-rule hover:bg-paper"
                data-testid={`project-${p.code}`}
              >
                <td className="px-3 py-1.5 font-medium">
                  <Link href={`/projects/${p.id}/items`} className="text-cost hover:underline">
                    {p.code}
                  </Link>
                </td>
                <td className="px-3 py-1.5">
                  {p.name}
                  {p.archived ? <span className="ml-2 text-xs text-ink-faint">archived</span> : null}
                </td>
                <td className="px-3 py-1.5">{p.stage}</td>
                <td className="px-3 py-1.5">Class {p.estimateClass}</td>
                <td className="px-3 py-1.5">{p.currency}</td>
                <td className="num px-3 py-1.5">
                  {p.lineCount ? (
                    formatMoney(p.baseEstimate, p.currency)
                  ) : (
                    <span className="text-ink-faint">no lines</span>
                  )}
                </td>
                <td className="num px-3 py-1.5">
                  {latest[p.id] ? (
                    <Link href={`/projects/${p.id}/runs/${latest[p.id].runId}`} className="hover:underline">
                      {formatMoney(latest[p.id].costP50, p.currency)} /{' '}
                      {formatMoney(latest[p.id].costP80, p.currency)}
                    </Link>
                  ) : (
                    '—'
                  )}
                </td>
                {mayWrite ? (
                  <td className="px-3 py-1.5">
                    <ProjectActions project={p} />
                  </td>
                ) : null}
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {mayWrite ? (
        <Card title="New project" className="max-w-3xl">
          <StartProject />
        </Card>
      ) : null}
    </div>
  );
}
