import { notFound } from 'next/navigation';
import { requirePageActor } from '@/lib/auth/guard';
import { getProject } from '@/lib/services/projects';
import { isAppError } from '@/lib/errors';

export default async function ProjectPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const actor = await requirePageActor('project:read', `/projects/${projectId}`);
  const project = await getProject(actor, Number(projectId)).catch((e) => {
    if (isAppError(e) && e.status === 404) notFound();
    throw e;
  });
  return (
    <div className="space-y-2">
      <p className="text-sm text-ink-faint">{project.code}</p>
      <h1 className="text-2xl font-semibold">{project.name}</h1>
      <p className="text-ink-soft">
        {project.stage} · Class {project.estimateClass} estimate · {project.currency} · base date{' '}
        {project.baseDate}
      </p>
      {project.description ? <p className="max-w-3xl">{project.description}</p> : null}
    </div>
  );
}
