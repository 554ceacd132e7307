// What every page of a project needs: the signed-in actor, the project (the not-found page for
// another organisation's, an unknown or a malformed id) and whether the actor may change it.
import { cache } from 'react';
import { requirePageActor } from '@/lib/auth/guard';
import { can, type Action } from '@/lib/auth/roles';
import { idParam } from '@/lib/http/params';
import { loadOrNotFound } from '@/lib/http/page';
import { getProject } from '@/lib/services/projects';

// Once per page render: the project's layout and its page both look the project up (the actor is
// the same object for both, from the guard's per-render cache).
const projectOf = cache(getProject);

/** `path`: the page below the project, for the sign-in page to come back to. */
export async function loadProjectPage(
  params: Promise<{ projectId: string }>,
  path: string,
  action: Action = 'project:read',
) {
  const { projectId } = await params;
  const actor = await requirePageActor(action, `/projects/${projectId}/${path}`);
  const project = await loadOrNotFound(() => projectOf(actor, idParam(projectId, 'Project')));
  return { actor, project, readOnly: !can(actor.role, 'project:write') || project.archived };
}
