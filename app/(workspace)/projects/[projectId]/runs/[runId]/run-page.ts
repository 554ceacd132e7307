// What the pages of one run need: the actor, the project and the run, each the not-found page
// when it is another organisation's, unknown or malformed.
import { cache } from 'react';
import type { Action } from '@/lib/auth/roles';
import { idParam } from '@/lib/http/params';
import { loadOrNotFound } from '@/lib/http/page';
import { getRun } from '@/lib/services/runs';
import { loadProjectPage } from '../../project-page';

export type RunParams = Promise<{ projectId: string; runId: string }>;

// Once per page render: the run's layout and its page both look the run up.
const runOf = cache(getRun);

/** `below`: the page under the run ('' or 'brief'), for the sign-in page to come back to. */
export async function loadRunPage(params: RunParams, below: string, action: Action) {
  const { runId } = await params;
  const { actor, project } = await loadProjectPage(
    params,
    below ? `runs/${runId}/${below}` : `runs/${runId}`,
    action,
  );
  const run = await loadOrNotFound(() => runOf(actor, project.id, idParam(runId, 'Run')));
  return { actor, project, run };
}
