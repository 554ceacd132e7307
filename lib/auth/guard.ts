import 'server-only';
import { getServerSession } from 'next-auth';
import { redirect } from 'next/navigation';
import { cache } from 'react';
import { authOptions } from './options';
import { can, type Action } from './roles';
import type { Actor } from './actor';
import { forbidden, unauthorized } from '@/lib/errors';
import { loadActor, loadSessionUser } from '@/lib/services/accounts';

/**
 * The signed-in actor with their current role, or null when signed out, no longer a member,
 * or holding a session that ended (signed out elsewhere, password reset). Read once per page
 * render (React's cache): the workspace's layout, the project's, the run's and the page each ask,
 * and each read decrypts the session and queries the membership. Route handlers read it afresh.
 */
export const currentActor = cache(async (): Promise<Actor | null> => {
  const session = await getServerSession(authOptions);
  if (!session?.userId || !session.organizationId || typeof session.sessionVersion !== 'number') return null;
  return loadActor(session.userId, session.organizationId, session.sessionVersion);
});

/** The signed-in person, member of any organisation or none; null when the session has ended. */
export const currentUser = cache(async () => {
  const session = await getServerSession(authOptions);
  if (!session?.userId || typeof session.sessionVersion !== 'number') return null;
  return loadSessionUser(session.userId, session.sessionVersion);
});

/** For route handlers and server actions: 401 when signed out, 403 when the role may not. */
export async function requireActor(action?: Action): Promise<Actor> {
  const actor = await currentActor();
  if (!actor) throw unauthorized();
  if (action && !can(actor.role, action)) throw forbidden();
  return actor;
}

/** For pages: signed out goes to sign-in, a role that may not goes to the forbidden page. */
export async function requirePageActor(action?: Action, returnTo?: string): Promise<Actor> {
  const actor = await currentActor();
  if (!actor) redirect(returnTo ? `/sign-in?callbackUrl=${encodeURIComponent(returnTo)}` : '/sign-in');
  if (action && !can(actor.role, action)) redirect('/forbidden');
  return actor;
}
