// A small HTTP client with a cookie jar, signed in through the real next-auth endpoints.
import crypto from 'node:crypto';
import { rowsOnce } from './db';

export const APP_URL = process.env.APP_URL ?? 'http://localhost:3100';
export const DEMO_PASSWORD = 'demo-outturn-2026';

export class Client {
  private cookies = new Map<string, string>();

  /** `base`: the app instance this client talks to (another web instance in queue-mode tests). */
  constructor(private readonly base = APP_URL) {}

  private remember(response: Response) {
    for (const header of response.headers.getSetCookie()) {
      const [pair] = header.split(';');
      const eq = pair.indexOf('=');
      this.cookies.set(pair.slice(0, eq).trim(), pair.slice(eq + 1));
    }
  }

  async request(
    path: string,
    init: {
      method?: string;
      body?: unknown;
      form?: Record<string, string>;
      headers?: Record<string, string>;
    } = {},
  ) {
    const headers: Record<string, string> = {
      ...init.headers,
      cookie: [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; '),
    };
    let body: string | undefined;
    if (init.form) {
      headers['content-type'] = 'application/x-www-form-urlencoded';
      body = new URLSearchParams(init.form).toString();
    } else if (init.body !== undefined) {
      headers['content-type'] ??= 'application/json';
      body = typeof init.body === 'string' ? init.body : JSON.stringify(init.body);
    }
    const response = await fetch(this.base + path, {
      method: init.method ?? (body ? 'POST' : 'GET'),
      headers,
      body,
      redirect: 'manual',
    });
    this.remember(response);
    const text = await response.text();
    let json: unknown = null;
    try {
      json = text ? JSON.parse(text) : null;
    } catch {
      json = null;
    }
    return { status: response.status, json: json as Record<string, any>, text, headers: response.headers };
  }

  get = (path: string) => this.request(path);
  post = (path: string, body?: unknown) => this.request(path, { method: 'POST', body: body ?? {} });
  put = (path: string, body: unknown) => this.request(path, { method: 'PUT', body });
  patch = (path: string, body: unknown) => this.request(path, { method: 'PATCH', body });
  del = (path: string) => this.request(path, { method: 'DELETE' });

  /** Signs in with e-mail and password; returns the error text next-auth gave, or null on success. */
  async signIn(email: string, password: string, address?: string): Promise<string | null> {
    const csrf = await this.get('/api/auth/csrf');
    const headers = address ? { 'x-forwarded-for': address } : undefined;
    const res = await this.request('/api/auth/callback/credentials', {
      method: 'POST',
      form: { csrfToken: csrf.json.csrfToken, email, password, json: 'true' },
      headers,
    });
    const url = String(res.json?.url ?? res.headers.get('location') ?? '');
    const error = new URL(url, APP_URL).searchParams.get('error');
    return error;
  }

  /** Signs out through next-auth's own route, as the sign-out button does. */
  async signOut() {
    const csrf = await this.get('/api/auth/csrf');
    return this.request('/api/auth/signout', {
      method: 'POST',
      form: { csrfToken: csrf.json.csrfToken, json: 'true' },
    });
  }

  /** A second client holding the same cookies: a copied session token (at `base`, if given). */
  copy(base = this.base): Client {
    const twin = new Client(base);
    for (const [k, v] of this.cookies) twin.cookies.set(k, v);
    return twin;
  }

  get signedIn() {
    return [...this.cookies.keys()].some((k) => k.endsWith('next-auth.session-token'));
  }
}

/** A unique e-mail, so tests never collide with each other or with earlier runs. */
export function uniqueEmail(label: string) {
  return `${label}-${crypto.randomBytes(5).toString('hex')}@test.example`;
}

/** Signs up a new organisation through the public route and returns its signed-in owner. */
export async function newOrganisation(label: string) {
  const email = uniqueEmail(label);
  const password = 'correct horse battery';
  const client = new Client();
  const res = await client.post('/api/sign-up', {
    name: `${label} owner`,
    organizationName: `${label} Ltd`,
    email,
    password,
  });
  if (res.status !== 202) throw new Error(`sign-up failed: ${res.status} ${res.text}`);
  const error = await client.signIn(email, password);
  if (error) throw new Error(`sign-in failed: ${error}`);
  // The sign-up reply says nothing about the account (it reads the same for a taken address).
  const [owned] = await rowsOnce<{ organizationId: number }>(
    'SELECT m.organizationId FROM Memberships m JOIN Users u ON u.id = m.userId WHERE u.email = ?',
    [email],
  );
  return { client, email, password, organizationId: owned.organizationId };
}

/** Invites someone with a role and accepts the invitation; returns their signed-in client. */
export async function addMember(owner: Client, role: string, label = role) {
  const email = uniqueEmail(label);
  const invited = await owner.post('/api/invitations', { email, role });
  if (invited.status !== 201) throw new Error(`invite failed: ${invited.status} ${invited.text}`);
  const token = String(invited.json.invitation.link).split('/').pop()!;
  const member = new Client();
  const password = 'another long password';
  const accepted = await member.post(`/api/invitations/accept/${token}`, {
    name: `${label} person`,
    password,
  });
  if (accepted.status !== 200) throw new Error(`accept failed: ${accepted.status} ${accepted.text}`);
  const error = await member.signIn(email, password);
  if (error) throw new Error(`member sign-in failed: ${error}`);
  return { client: member, email };
}

export async function demoClient(role: 'owner' | 'estimator' | 'sponsor' | 'billing') {
  const client = new Client();
  const error = await client.signIn(`${role}@kestrelvale.example`, DEMO_PASSWORD);
  if (error) throw new Error(`demo sign-in failed: ${error}`);
  return client;
}
