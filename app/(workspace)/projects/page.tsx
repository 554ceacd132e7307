import Link from 'next/link';
import { requirePageActor } from '@/lib/auth/guard';
import { can } from '@/lib/auth/roles';
import { listProjects } from '@/lib/services/projects';
import { Card, EmptyState } from '@/components/ui/card';
import { NewProjectForm } from '@/components/projects/new-project-form';

export const metadata = { title: 'Projects' };

export default async function ProjectsPage() {
  const actor = await requirePageActor('project:read', '/projects');
  const projects = await listProjects(actor);
  const mayWrite = can(actor.role, 'project:write');
  return (
    <div className="space-y-5">
      <h1 className="text-2xl font-semibold">Projects</h1>
      {projects.length === 0 ? (
        <EmptyState title="No projects yet">
          {mayWrite
            ? 'Create the first project below, then add its line items, risks and schedule.'
            : 'An estimator or owner creates the projects you will read here.'}
        </EmptyState>
      ) : (
        <table className="w-full border-collapse rounded border border-rule bg-paper-raised text-sm">
          <thead className="bg-paper-sunk text-left text-xs uppercase tracking-wide text-ink-soft">
            <tr>
              <th className="px-3 py-2">Code</th>
              <th className="px-3 py-2">Name</th>
              <th className="px-3 py-2">Stage</th>
              <th className="px-3 py-2">Class</th>
              <th className="px-3 py-2">Currency</th>
              <th className="px-3 py-2">Base date</th>
            </tr>
          </thead>
          <tbody>
            {projects.map((p) => (
              <tr key={p.id} className="border-t border-rule hover:bg-paper">
                <td className="px-3 py-1.5 font-medium">
                  <Link href={`/projects/${p.id}`} className="text-cost hover:underline">
                    {p.code}
                  </Link>
                </td>
                <td className="px-3 py-1.5">{p.name}</td>
                <td className="px-3 py-1.5">{p.stage}</td>
                <td className="px-3 py-1.5">Class {p.estimateClass}</td>
                <td className="px-3 py-1.5">{p.currency}</td>
                <td className="num px-3 py-1.5">{p.baseDate}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {mayWrite ? (
        <Card title="New project" className="max-w-3xl">
          <NewProjectForm />
        </Card>
      ) : null}
    </div>
  );
}
