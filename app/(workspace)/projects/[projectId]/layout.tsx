import { loadProjectPage } from './project-page';
import { ProjectTabs } from '@/components/projects/project-tabs';
import { DraftOwnerProvider } from '@/components/grid/draft-owner';

export default async function ProjectLayout({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ projectId: string }>;
}) {
  const { actor, project, readOnly } = await loadProjectPage(params, '');
  return (
    <div className="space-y-3">
      <header className="flex flex-wrap items-baseline gap-x-4 gap-y-1">
        <span className="text-sm font-semibold text-cost" data-testid="project-code">
          {project.code}
        </span>
        <h1 className="text-2xl font-semibold">{project.name}</h1>
        <span className="text-sm text-ink-soft">
          {project.stage} · Class {project.estimateClass} estimate · {project.currency}
          {project.archived ? ' · archived' : ''}
          {readOnly ? ' · read only' : ''}
        </span>
      </header>
      <ProjectTabs projectId={project.id} />
      {/* Rows not saved yet are kept per user in this browser. */}
      <DraftOwnerProvider userId={actor.userId}>{children}</DraftOwnerProvider>
    </div>
  );
}
