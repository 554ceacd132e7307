import type { Role } from './roles';

/** The signed-in person acting within one organisation, as every service receives it. */
export type Actor = {
  userId: number;
  organizationId: number;
  role: Role;
  email: string;
  name: string;
};
