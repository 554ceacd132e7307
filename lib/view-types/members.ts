// What the pages see of members and invitations: a plain JSON shape that the service produces and the
// components render. No server code here, so client components may import it.
import type { Role } from '@/lib/auth/roles';

export type MemberView = {
  id: number;
  userId: number;
  name: string;
  email: string;
  role: Role;
  since: string;
};

export type InvitationView = { id: number; email: string; role: Role; expiresAt: string; link: string };
