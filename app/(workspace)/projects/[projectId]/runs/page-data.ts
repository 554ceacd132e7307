import { notFound } from 'next/navigation';
import type { Actor } from '@/lib/auth/actor';
import { isAppError } from '@/lib/errors';
import { getProject } from '@/lib/services/projects';

/** Another organisation's project, or one that does not exist, is the not-found page. */
export async function orNotFound<T>(load: Promise<T>): Promise<T> {
  try {
    return await load;
  } catch (e) {
    if (isAppError(e) && e.status === 404) notFound();
    throw e;
  }
}

export const projectFor = (actor: Actor, projectId: string) =>
  orNotFound(getProject(actor, Number(projectId)));
