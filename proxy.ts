import { NextResponse, type NextFetchEvent, type NextRequest } from 'next/server';
import { withAuth, type NextRequestWithAuth } from 'next-auth/middleware';
import { contentSecurityPolicy, strictTransportSecurity } from '@/lib/http/content-security';
import { REQUEST_ID_HEADER, requestIdFrom } from '@/lib/log/request-id';
const SIGN_IN_REQUIRED = ['/projects', '/settings'];

/** Every matched request: its id, given to the app through the request and echoed in the reply. */
function withRequestId(request: NextRequest, headers: Headers): string {
  const id = requestIdFrom(request.headers);
  headers.set(REQUEST_ID_HEADER, id);
  return id;
}

/** API routes: only the request id (the route wrapper checks Origin, the session and the role). */
function forApi(request: NextRequest): NextResponse {
  const headers = new Headers(request.headers);
  const id = withRequestId(request, headers);
  const response = NextResponse.next({ request: { headers } });
  response.headers.set(REQUEST_ID_HEADER, id);
  return response;
}

/** Pages: the request id, and a fresh nonce for the content security policy. */
function withSecurityHeaders(request: NextRequest): NextResponse {
  const nonce = btoa(crypto.randomUUID());
  const policy = contentSecurityPolicy(nonce);
  const headers = new Headers(request.headers);
  const id = withRequestId(request, headers);
  headers.set('content-security-policy', policy);
  const response = NextResponse.next({ request: { headers } });
  response.headers.set('content-security-policy', policy);
  response.headers.set(REQUEST_ID_HEADER, id);
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
  if (pathname.startsWith('/api/')) return forApi(request);
  if (SIGN_IN_REQUIRED.some((p) => pathname === p || pathname.startsWith(`${p}/`))) {
    return signedInPages(request as NextRequestWithAuth, event);
  }
  return withSecurityHeaders(request);
}

export const config = {
  // Pages and route handlers, but not the register upload: Next.js copies the body of every
  // request the proxy sees and cuts it at 10 MB, which would cut an upload short. That route
  // gets its request id from the route wrapper (lib/http/route.ts), as any route would without
  // the proxy. Next.js's static files carry the headers of next.config.mjs.
  matcher: ['/((?!api/projects/[^/]+/import(?:/|$)|_next/static|_next/image|favicon.ico).*)'],
};
