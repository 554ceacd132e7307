// The client address that the per-address limits count against.
//
// Next.js 16 gives route handlers and next-auth's authorize no socket address: it writes the
// socket's address into X-Forwarded-For only when the request carries none, so any client can
// put any value there. The header is therefore believed only when TRUSTED_PROXIES lists the
// proxies in front of the app (comma-separated addresses); each of them appends the address it
// saw, so reading right to left, the first address that is not one of ours is the client.
// With no proxies configured the header proves nothing, and every request counts against one
// shared key: a spray of guesses is still limited, at the price of one limit for everybody.
export const UNVERIFIED_ADDRESS = 'unverified';

/** Lower case, no brackets or IPv4-in-IPv6 prefix, so one address has one spelling. */
function normalize(address: string): string {
  return address
    .trim()
    .toLowerCase()
    .replace(/^\[(.*)\]$/, '$1')
    .replace(/^::ffff:(\d+\.\d+\.\d+\.\d+)$/, '$1');
}

export function trustedProxies(list = process.env.TRUSTED_PROXIES ?? ''): ReadonlySet<string> {
  return new Set(list.split(',').map(normalize).filter(Boolean));
}

export function clientAddress(
  forwardedFor: string | string[] | null | undefined,
  proxies: ReadonlySet<string> = trustedProxies(),
): string {
  if (proxies.size === 0) return UNVERIFIED_ADDRESS;
  const header = Array.isArray(forwardedFor) ? forwardedFor.join(',') : (forwardedFor ?? '');
  const hops = header.split(',').map(normalize).filter(Boolean);
  for (let i = hops.length - 1; i >= 0; i--) {
    if (!proxies.has(hops[i])) return hops[i];
  }
  // Every hop is one of our proxies: the request came from the proxy itself.
  return hops[0] ?? UNVERIFIED_ADDRESS;
}
