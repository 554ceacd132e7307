/**
 * The id of one HTTP request, for finding every log line it caused. A caller (a balancer, a
 * reverse proxy, another service) may pass its own in `x-request-id` so that its logs and
 * ours share it; anything that is not a short plain token is replaced, so a header cannot
 * forge log lines or fill them with megabytes. Safe in the proxy: Web APIs only.
 */

export const REQUEST_ID_HEADER = 'x-request-id';

// Letters, digits and . _ : - only (UUIDs, ULIDs, hex trace ids), at most 128 characters.
const SANE = /^[A-Za-z0-9._:-]{1,128}$/;

export function isSaneRequestId(value: string | null | undefined): value is string {
  return typeof value === 'string' && SANE.test(value);
}

/** The incoming id when it is sane, otherwise a new random one. */
export function requestIdFrom(headers: Headers): string {
  const incoming = headers.get(REQUEST_ID_HEADER)?.trim();
  return isSaneRequestId(incoming) ? incoming : crypto.randomUUID();
}
