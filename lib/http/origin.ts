// Cross-site request check for state-changing routes. A browser names the page that made a
// request in Origin; a foreign page may post to us (with a form or text/plain fetch) but it
// cannot forge that header. Requests without Origin (scripts, the payment service) pass here
// and meet the JSON and session checks instead.
const STATE_CHANGING = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

// Signed with its own secret over the raw body, and sent by the payment service, not a browser.
export const ORIGIN_EXEMPT_PATHS: ReadonlySet<string> = new Set(['/api/webhooks/payments']);

export function isForeignOrigin(
  method: string,
  origin: string | null,
  host: string | null,
  appUrl = process.env.APP_URL,
): boolean {
  if (!STATE_CHANGING.has(method.toUpperCase()) || origin === null) return false;
  let from: URL;
  try {
    from = new URL(origin);
  } catch {
    return true; // "null" (a sandboxed or opaque page) and anything unreadable
  }
  if (appUrl) {
    try {
      if (from.origin === new URL(appUrl).origin) return false;
    } catch {
      // A malformed APP_URL only leaves the host comparison.
    }
  }
  return host === null || from.host !== host;
}
