// The content security policy of every page. Scripts run only from our own origin or with the
// nonce of this response (Next.js puts it on its own inline scripts when it finds it in the
// request's policy); styles may be inline, because React style attributes and the grid's
// theme write them. Nothing may frame the app, and forms post only to it.
export function contentSecurityPolicy(nonce: string): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}'`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self' data:",
    "connect-src 'self'",
    "worker-src 'self' blob:",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join('; ');
}

/** HSTS only where the app is served over https: a plain-http install must stay reachable. */
export function strictTransportSecurity(appUrl = process.env.APP_URL ?? ''): string | null {
  return appUrl.startsWith('https://') ? 'max-age=31536000; includeSubDomains' : null;
}
