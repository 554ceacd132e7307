import { withAuth } from 'next-auth/middleware';

// Only redirects signed-out visitors; roles and organisations are checked by the guard.
export default withAuth({ pages: { signIn: '/sign-in' } });

export const config = { matcher: ['/projects/:path*', '/settings/:path*'] };
