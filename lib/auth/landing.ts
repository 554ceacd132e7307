// Where each role starts: the first page its work begins on, and where "back" leads from a page
// the role may not see (a link that pointed at a forbidden page would loop).
import { can, type Role } from './roles';

export function landingPath(role: Role): string {
  if (can(role, 'project:read')) return '/projects';
  if (can(role, 'billing:read')) return '/settings/billing';
  return '/settings/notifications';
}
