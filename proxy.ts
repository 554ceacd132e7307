import { NextResponse, type NextFetchEvent, type NextRequest } from 'next/server';
import { withAuth, type NextRequestWithAuth } from 'next-auth/middleware';
import { contentSecurityPolicy, strictTransportSecurity } from '@/lib/http/content-security';
const SIGN_IN_REQUIRED = ['/projects', '/settings'];

/** Pages: a fresh nonce for the content security policy, given to Next.js through the request. */
function withSecurityHeaders(request: NextRequest): NextResponse {
  const nonce = btoa(crypto.randomUUID());
  const policy = contentSecurityPolicy(nonce);
  const headers = new Headers(request.headers);
  headers.set('content-security-policy', policy);
  const response = NextResponse.next({ request: { headers } });
  response.headers.set('content-security-policy', policy);
  const hsts = strictTransportSecurity();
  if (hsts) response.headers.set('strict-transport-security', hsts);
  return response;
}

// Only redirects signed-out visitors; roles and organisations are checked by the guard.
const signedInPages = withAuth((request: NextRequestWithAuth) => withSecurityHeaders(request), {
  pages: { signIn: '/sign-in' },
});

export default function proxy(request: NextRequest, event: NextFetchEvent) {
  const { pathname } = request.nextUrl;
  if (SIGN_IN_REQUIRED.some((p) => pathname === p || pathname.startsWith(`${p}/`))) {
    return signedInPages(request as NextRequestWithAuth, event);
  }
  return withSecurityHeaders(request);
}

export const config = {
  // Pages only. Route handlers check Origin in lib/http/route.ts: a proxy that matched them
  // would buffer every upload. Next.js's static files carry the headers of next.config.mjs.
  matcher: ['/((?!api/|_next/static|_next/image|favicon.ico).*)'],
};
