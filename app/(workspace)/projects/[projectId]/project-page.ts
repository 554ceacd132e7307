// What every tab of a project needs: the signed-in actor, the project (404 for another
// organisation's) and whether the actor may change it.
import { notFound } from 'next/navigation';
import { requirePageActor } from '@/lib/auth/guard';
import { can } from '@/lib/auth/roles';
import { isAppError } from '@/lib/errors';
import { getProject } from '@/lib/services/projects';

export async function loadProjectPage(params: Promise<{ projectId: string }>, tab: string) {
  const { projectId } = await params;
  const actor = await requirePageActor('project:read', `/projects/${projectId}/${tab}`);
  const project = await getProject(actor, Number(projectId)).catch((e) => {
    if (isAppError(e) && e.status === 404) notFound();
    throw e;
  });
  return { actor, project, readOnly: !can(actor.role, 'project:write') || project.archived };
}
