// HTTP for the scale benchmark: a signed-in session (the real next-auth credentials flow), a
// small JSON client on that session, and autocannon load on read APIs (requests per second,
// latency percentiles, errors).
import autocannon from 'autocannon';

export const DEMO_PASSWORD = 'demo-outturn-2026';

function cookiesOf(response: Response, jar: Map<string, string>) {
  for (const header of response.headers.getSetCookie()) {
    const [pair] = header.split(';');
    const eq = pair.indexOf('=');
    jar.set(pair.slice(0, eq).trim(), pair.slice(eq + 1));
  }
}

/** Signs in as `email` through next-auth's credentials route; returns the Cookie header to send. */
export async function signInCookie(appUrl: string, email: string, password = DEMO_PASSWORD): Promise<string> {
  const jar = new Map<string, string>();
  const header = () => [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
  const csrf = await fetch(`${appUrl}/api/auth/csrf`);
  cookiesOf(csrf, jar);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const res = await fetch(`${appUrl}/api/auth/callback/credentials`, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded', cookie: header() },
    body: new URLSearchParams({ csrfToken, email, password, json: 'true' }).toString(),
    redirect: 'manual',
  });
  cookiesOf(res, jar);
  if (![...jar.keys()].some((k) => k.endsWith('next-auth.session-token'))) {
    throw new Error(`sign-in as ${email} at ${appUrl} failed (status ${res.status})`);
  }
  return header();
}

/** JSON calls on a signed-in session; any status other than the expected one throws, naming the call. */
export function apiClient(appUrl: string, cookie: string) {
  async function call<T>(method: string, path: string, body?: unknown, expect = 200): Promise<T> {
    const res = await fetch(appUrl + path, {
      method,
      headers: {
        cookie,
        accept: 'application/json',
        ...(body ? { 'content-type': 'application/json' } : {}),
      },
      body: body ? JSON.stringify(body) : undefined,
    });
    const text = await res.text();
    if (res.status !== expect) throw new Error(`${method} ${path}: ${res.status} ${text.slice(0, 300)}`);
    return (text ? JSON.parse(text) : null) as T;
  }
  return {
    get: <T>(path: string) => call<T>('GET', path),
    post: <T>(path: string, body: unknown, expect = 200) => call<T>('POST', path, body, expect),
  };
}
export type ApiClient = ReturnType<typeof apiClient>;

/** Signs up a new organisation through the public route and returns its owner's signed-in client. */
export async function newOrganisation(appUrl: string, label: string): Promise<ApiClient> {
  const email = `${label}-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 8)}@bench.example`;
  const password = 'bench password of some length';
  const res = await fetch(`${appUrl}/api/sign-up`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ name: `${label} owner`, organizationName: `${label} Ltd`, email, password }),
  });
  if (res.status !== 202) throw new Error(`sign-up of ${label} failed: ${res.status} ${await res.text()}`);
  return apiClient(appUrl, await signInCookie(appUrl, email, password));
}

export type LoadFigures = {
  requestsPerSecond: number;
  p50: number;
  p95: number;
  p97_5: number;
  p99: number;
  max: number;
  total: number;
  errors: number;
  non2xx: number;
};

/** The q-quantile of sorted values, nearest rank (common practice for latency percentiles). */
function nearestRank(sorted: number[], q: number): number {
  if (sorted.length === 0) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1))];
}

/**
 * `connections` connections for `seconds` seconds on the URLs (autocannon spreads the
 * connections over them in turn). Latencies in milliseconds; p95 from every response's time
 * (autocannon's own percentiles skip p95), the rest as autocannon reports them.
 */
export async function load(
  urls: string[],
  cookie: string,
  { connections = 50, seconds = 10 } = {},
): Promise<LoadFigures> {
  const times: number[] = [];
  const instance = autocannon({
    url: urls.length === 1 ? urls[0] : urls,
    connections,
    duration: seconds,
    headers: { cookie, accept: 'application/json' },
    timeout: 30,
  });
  instance.on('response', (_client: unknown, _status: number, _bytes: number, ms: number) => times.push(ms));
  const result = await instance;
  times.sort((a, b) => a - b);
  return {
    requestsPerSecond: result.requests.total / result.duration,
    p50: result.latency.p50,
    p95: nearestRank(times, 0.95),
    p97_5: result.latency.p97_5,
    p99: result.latency.p99,
    max: result.latency.max,
    total: result.requests.total,
    errors: result.errors + result.timeouts,
    non2xx: result.non2xx,
  };
}

export function formatLoad(name: string, f: LoadFigures): string {
  const ms = (v: number) => `${Math.round(v)} ms`.padStart(8);
  return (
    `${name.padEnd(34)} ${f.requestsPerSecond.toFixed(0).padStart(6)} req/s  p50 ${ms(f.p50)}  ` +
    `p95 ${ms(f.p95)}  p97.5 ${ms(f.p97_5)}  p99 ${ms(f.p99)}  errors ${f.errors}  non-2xx ${f.non2xx}`
  );
}
