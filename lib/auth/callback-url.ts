// Where to go after signing in: only a path on this site. `//host` and `/\host` are read by
// browsers as another site, and control characters are dropped by URL parsers before that
// reading, so all three are refused.
const PROBE_ORIGIN = 'http://outturn.invalid';

export function safeCallbackPath(value: string | null | undefined, fallback = '/projects'): string {
  if (!value || !value.startsWith('/') || value.startsWith('//')) return fallback;
  // eslint-disable-next-line no-control-regex
  if (/[\\\u0000-\u001f\u007f]/.test(value)) return fallback;
  let url: URL;
  try {
    url = new URL(value, PROBE_ORIGIN);
  } catch {
    return fallback;
  }
  if (url.origin !== PROBE_ORIGIN) return fallback;
  return `${url.pathname}${url.search}${url.hash}`;
}

/** For next-auth's redirect callback: an absolute URL on `baseUrl`, never another site. */
export function sameSiteRedirect(url: string, baseUrl: string): string {
  let path = url;
  if (!url.startsWith('/')) {
    try {
      const target = new URL(url);
      if (target.origin !== new URL(baseUrl).origin) return baseUrl;
      path = `${target.pathname}${target.search}${target.hash}`;
    } catch {
      return baseUrl;
    }
  }
  return `${baseUrl}${safeCallbackPath(path, '/')}`;
}
