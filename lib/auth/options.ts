import 'server-only';
import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import { endSessions, verifyCredentials } from '@/lib/services/accounts';
import { signInSchema } from '@/lib/validation/auth';
import type { Role } from './roles';
import { assertMaySignIn, recordFailedSignIn, recordSuccessfulSignIn } from './sign-in-limit';
import { clientAddress } from './client-address';
import { sameSiteRedirect } from './callback-url';

export const authOptions: NextAuthOptions = {
  session: { strategy: 'jwt', maxAge: 12 * 60 * 60 },
  pages: { signIn: '/sign-in' },
  providers: [
    CredentialsProvider({
      name: 'E-mail and password',
      credentials: {
        email: { label: 'E-mail', type: 'email' },
        password: { label: 'Password', type: 'password' },
      },
      async authorize(credentials, req) {
        const parsed = signInSchema.safeParse(credentials);
        if (!parsed.success) throw new Error('Enter your e-mail address and password.');
        const { email, password } = parsed.data;
        const address = clientAddress(req?.headers?.['x-forwarded-for']);
        await assertMaySignIn(email, address);
        const user = await verifyCredentials(email, password);
        if (!user) {
          await recordFailedSignIn(email, address);
          throw new Error('That e-mail and password do not match an account.');
        }
        await recordSuccessfulSignIn(email);
        return {
          id: String(user.id),
          email: user.email,
          name: user.name,
          organizationId: user.organizationId,
          role: user.role,
          sessionVersion: user.sessionVersion,
        };
      },
    }),
  ],
  callbacks: {
    async jwt({ token, user }) {
      if (user) {
        token.userId = Number(user.id);
        const signedIn = user as unknown as { organizationId: number; role: Role; sessionVersion: number };
        token.organizationId = signedIn.organizationId;
        token.role = signedIn.role;
        token.sessionVersion = signedIn.sessionVersion;
      }
      return token;
    },
    async session({ session, token }) {
      session.userId = token.userId as number;
      session.organizationId = token.organizationId as number;
      session.role = token.role as Role;
      session.sessionVersion = token.sessionVersion as number;
      return session;
    },
    async redirect({ url, baseUrl }) {
      return sameSiteRedirect(url, baseUrl);
    },
  },
  events: {
    // Signing out ends the session everywhere, so a copied token dies with it. One version per
    // user: signing out on one device signs out the others too.
    async signOut({ token }) {
      const userId = Number(token?.userId);
      if (Number.isInteger(userId) && userId > 0) await endSessions(userId);
    },
  },
};
