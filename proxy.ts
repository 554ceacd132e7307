import { NextResponse, type NextFetchEvent, type NextRequest } from 'next/server';
import { withAuth, type NextRequestWithAuth } from 'next-auth/middleware';
import { contentSecurityPolicy, strictTransportSecurity } from '@/lib/http/content-security';
import { isForeignOrigin } from '@/lib/http/origin';

// Signed with its own secret over the raw body, and sent by the payment service, not a browser.
const ORIGIN_EXEMPT = new Set(['/api/webhooks/payments']);
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
  if (pathname.startsWith('/api/')) {
    if (
      !ORIGIN_EXEMPT.has(pathname) &&
      isForeignOrigin(request.method, request.headers.get('origin'), request.headers.get('host'))
    ) {
      return NextResponse.json(
        { error: { code: 'forbidden', message: 'Requests from another origin are refused.' } },
        { status: 403 },
      );
    }
    return NextResponse.next();
  }
  if (SIGN_IN_REQUIRED.some((p) => pathname === p || pathname.startsWith(`${p}/`))) {
    return signedInPages(request as NextRequestWithAuth, event);
  }
  return withSecurityHeaders(request);
}

export const config = {
  // Everything but Next.js's own static files: those carry the fixed headers of next.config.mjs.
  matcher: ['/((?!_next/static|_next/image|favicon.ico).*)'],
};
