import 'next-auth';
import type { Role } from '@/lib/auth/roles';

declare module 'next-auth' {
  interface Session {
    userId: number;
    organizationId: number;
    /** The role at sign-in; the guard reloads the current one on every request. */
    role: Role;
    /** The user's session version at sign-in; the guard refuses it once the user's is higher. */
    sessionVersion: number;
  }
}
