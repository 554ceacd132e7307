// Every API route × every role and signed-out × own and foreign organisation. The routes are
// read from the files under app/api (which HTTP methods each exports, and which permission its
// handler asks for), so a new route is in the matrix the day it is written. Expected statuses come
// from the permission table (lib/auth/roles.ts): signed out → 401; a role without the permission →
// 403; the ids of another organisation's records → 404; the own organisation's → anything but
// 401/403/404 and never a 5xx. No reply may contain the foreign organisation's names or codes.
import fs from 'node:fs';
import path from 'node:path';
import crypto from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addMember, Client, newOrganisation, uniqueEmail, APP_URL } from './helpers/http';
import { closeDb } from './helpers/db';
import { ACTIONS, can, ROLES, type Action, type Role } from '@/lib/auth/roles';

const API = path.join(process.cwd(), 'app/api');
type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

/** Routes any visitor may call, and why they take no session. */
const PUBLIC: Record<string, string> = {
  'GET /api/auth/[...nextauth]': 'the sign-in endpoints themselves (csrf, session, providers)',
  'POST /api/auth/[...nextauth]': 'signing in and out',
  'POST /api/sign-up': 'making a new account and organisation',
  'POST /api/password-reset': 'asking for a reset link while signed out',
  'POST /api/password-reset/[token]': 'the token in the e-mailed link is the credential',
  'POST /api/invitations/accept/[token]': 'the token in the invitation is the credential',
  'POST /api/webhooks/payments': 'signed by the payment service, not by a session',
  'GET /api/health': 'for load balancers: says whether the instance can serve, nothing of any organisation',
};

type Route = { template: string; method: Method; action: Action | 'member' | 'public' };

/** The source of each exported method's handler: its own file, or the shared register handlers. */
function handlerSources(file: string): Map<Method, string> {
  let source = fs.readFileSync(file, 'utf8');
  const out = new Map<Method, string>();
  for (const m of source.matchAll(/handler as (GET|POST)/g)) out.set(m[1] as Method, '');
  const shared = source.match(/register(Row)?Routes\(/);
  if (shared) {
    const handlers = fs.readFileSync(path.join(API, 'projects/[id]/register-handlers.ts'), 'utf8');
    const start = handlers.indexOf(`export function register${shared[1] ?? ''}Routes(`);
    const end = handlers.indexOf('\nexport function', start + 1);
    source = handlers.slice(start, end < 0 ? undefined : end);
  }
  const definitions = [
    ...source.matchAll(/(?:export (?:const|async function) |^\s+)(GET|POST|PUT|PATCH|DELETE)\b\s*[=:(]/gm),
  ];
  definitions.forEach((m, i) => out.set(m[1] as Method, source.slice(m.index, definitions[i + 1]?.index)));
  return out;
}

function discoverRoutes(): Route[] {
  const files = (fs.readdirSync(API, { recursive: true }) as string[])
    .filter((f) => f.endsWith(`${path.sep}route.ts`) || f === 'route.ts')
    .sort();
  return files.flatMap((f) => {
    const template = `/api/${path.dirname(f).split(path.sep).join('/')}`.replace(/\/\.$/, '');
    return [...handlerSources(path.join(API, f))].map(([method, source]) => {
      const call = source.match(/requireActor\((?:'([a-z:]+)')?\)/);
      const action = !call ? 'public' : call[1] ? (call[1] as Action) : 'member';
      return { template, method, action };
    });
  });
}

type OrgRecords = {
  clients: Partial<Record<Role, Client>>;
  ids: Record<string, string>;
  tokens: string[];
};

const rand = () => crypto.randomBytes(4).toString('hex').toUpperCase();

async function buySeats(client: Client, seats: number) {
  const started = await client.post('/api/billing/checkout', { seats });
  expect(started.status).toBe(201);
  await fetch(`${started.json.checkout.url}/pay`, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: 'card=4242424242424242&expiry=12%2F34&cvc=123',
    redirect: 'manual',
  });
}

/** An organisation with a member of every role, a project with registers, a run, a decision, an invoice. */
async function organisation(label: string, everyRole: boolean): Promise<OrgRecords> {
  const tag = `${label}${rand()}`;
  const org = await newOrganisation(`matrix-${label.toLowerCase()}`);
  const owner = org.client;
  const clients: OrgRecords['clients'] = { owner };
  await buySeats(owner, 5);
  for (const role of everyRole ? (['estimator', 'sponsor', 'billing'] as const) : [])
    clients[role] = (await addMember(owner, role)).client;
  const spare = await addMember(owner, 'sponsor', `${label.toLowerCase()}-spare`);
  const invited = uniqueEmail(`${label.toLowerCase()}-invited`);
  expect((await owner.post('/api/invitations', { email: invited, role: 'sponsor' })).status).toBe(201);
  const project = await owner.post('/api/projects', {
    name: `Project ${tag}`,
    code: `P-${tag}`,
    currency: 'EUR',
    estimateClass: 3,
    stage: 'Feasibility',
    baseDate: '2027-01-04',
  });
  expect(project.status).toBe(201);
  const projectId = project.json.project.id;
  const imported = await owner.post(`/api/projects/${projectId}/import`, {
    format: 'outturn-model',
    version: 2,
    items: [
      { id: `I-${tag}`, name: `Item ${tag}`, dist: { type: 'triangular', low: 90, mode: 100, high: 130 } },
      { id: `J-${tag}`, name: 'Second', base: 50 },
    ],
    risks: [{ id: `R-${tag}`, name: `Risk ${tag}`, probability: 0.3, cost: { type: 'fixed', value: 10 } }],
    activities: [{ id: `A-${tag}`, name: `Activity ${tag}`, duration: { type: 'uniform', low: 5, high: 9 } }],
    correlations: [{ a: `I-${tag}`, b: `J-${tag}`, rho: 0.4 }],
    drivers: [
      {
        id: `D-${tag}`,
        name: `Driver ${tag}`,
        factor: { type: 'triangular', low: 0.9, mode: 1, high: 1.2 },
        applies: [`I-${tag}`, `A-${tag}`],
      },
    ],
  });
  expect(imported.status).toBe(200);
  const started = await owner.post(`/api/projects/${projectId}/runs`, { iterations: 1000, seed: 5 });
  expect(started.status).toBeLessThan(300);
  const runId = started.json.run.id;
  for (let i = 0; i < 300; i++) {
    const run = await owner.get(`/api/projects/${projectId}/runs/${runId}`);
    if (run.json.run.status === 'succeeded') break;
    expect(['queued', 'running']).toContain(run.json.run.status);
    await new Promise((r) => setTimeout(r, 200));
  }
  // The owner started the run: approving it too needs the organisation's leave (separation of duties).
  expect((await owner.put('/api/organization', { allowSelfApproval: true })).status).toBe(200);
  const decided = await owner.post(`/api/projects/${projectId}/decisions`, { runId, decision: 'approved' });
  expect(decided.status).toBe(201);
  const first = async (register: string) =>
    String((await owner.get(`/api/projects/${projectId}/${register}`)).json.rows[0].id);
  const members = (await owner.get('/api/members')).json.members as { id: number; email: string }[];
  const invitations = (await owner.get('/api/invitations')).json.invitations as { id: number }[];
  const invoices = (await owner.get('/api/billing')).json.billing.invoices as { id: number }[];
  return {
    clients,
    ids: {
      project: String(projectId),
      run: String(runId),
      decision: String(decided.json.decision.id),
      items: await first('items'),
      risks: await first('risks'),
      activities: await first('activities'),
      correlations: await first('correlations'),
      drivers: await first('drivers'),
      member: String(members.find((m) => m.email === spare.email)!.id),
      invitation: String(invitations[0].id),
      invoice: String(invoices[0].id),
    },
    tokens: [
      `Project ${tag}`,
      `P-${tag}`,
      `I-${tag}`,
      `Item ${tag}`,
      `R-${tag}`,
      `A-${tag}`,
      `D-${tag}`,
      spare.email,
      invited,
      org.email,
    ],
  };
}

/** The path with its parameters filled from one organisation's records. */
function fill(template: string, ids: Record<string, string>): string {
  const url = template.replace(/\[([^\]]+)\]/g, (_, name: string, offset: number) => {
    const before = template.slice(0, offset);
    const pick = (key: string) => ids[key];
    if (name === '...nextauth') return 'session';
    if (name === 'token') return 'no-such-token';
    if (name === 'runId') return pick('run');
    if (name === 'decisionId') return pick('decision');
    if (name === 'rowId') return pick(before.split('/').at(-2)!);
    if (before.endsWith('/projects/')) return pick('project');
    if (before.endsWith('/members/')) return pick('member');
    if (before.endsWith('/invitations/')) return pick('invitation');
    if (before.endsWith('/invoices/')) return pick('invoice');
    throw new Error(`No record to fill ${name} in ${template}: add it to the matrix.`);
  });
  return url;
}

/** Bodies that fail validation where a valid one would start work (a run) or change the organisation. */
function bodyFor(route: Route): unknown {
  if (route.method === 'GET' || route.method === 'DELETE') return undefined;
  if (route.template.endsWith('/runs')) return { iterations: 1 };
  return {};
}

let own: OrgRecords;
let foreign: OrgRecords;
const routes = discoverRoutes();
const outcomes: { line: string; ok: boolean }[] = [];
let requests = 0;

beforeAll(async () => {
  own = await organisation('Own', true);
  foreign = await organisation('Foreign', false);
}, 240_000);

afterAll(async () => {
  await closeDb();
});

describe('the route matrix', () => {
  it('covers every route file under app/api, each method with a permission or listed as public', () => {
    expect(routes.length).toBeGreaterThan(40);
    const unguarded = routes.filter((r) => r.action === 'public').map((r) => `${r.method} ${r.template}`);
    expect(unguarded.sort()).toEqual(Object.keys(PUBLIC).sort());
    for (const r of routes)
      if (r.action !== 'public' && r.action !== 'member') expect(ACTIONS).toContain(r.action);
  });

  it('answers each role and organisation as the permission table says, and never shows foreign data', async () => {
    type Case = { route: Route; who: Role | 'signed-out'; org: 'own' | 'foreign'; url: string };
    const cases: Case[] = [];
    for (const route of routes) {
      for (const org of ['own', 'foreign'] as const) {
        const ids = (org === 'own' ? own : foreign).ids;
        let url = fill(route.template, ids);
        if (org === 'foreign' && url === fill(route.template, own.ids)) continue; // takes no record id
        if (route.method === 'DELETE') url += '?version=999';
        for (const who of [...ROLES, 'signed-out'] as const) cases.push({ route, who, org, url });
      }
    }
    // Changes to the own organisation's subscription go last, so they cannot colour the rest.
    cases.sort(
      (a, b) =>
        Number(a.route.template.startsWith('/api/billing/cancel')) -
        Number(b.route.template.startsWith('/api/billing/cancel')),
    );
    const anonymous = new Client();
    const ownStatus = new Map<string, number>();
    const run = async (c: Case) => {
      const client = c.who === 'signed-out' ? anonymous : own.clients[c.who]!;
      const body = bodyFor(c.route);
      const res = await client.request(c.url, { method: c.route.method, body });
      requests++;
      const { action } = c.route;
      let expected: string;
      let ok: boolean;
      if (action === 'public') {
        expected = '< 500';
        ok = res.status < 500;
      } else if (c.who === 'signed-out') {
        expected = '401';
        ok = res.status === 401;
      } else if (action !== 'member' && !can(c.who, action)) {
        expected = '403';
        ok = res.status === 403;
      } else if (c.org === 'foreign') {
        // A body refused before any record is read says nothing about the record: the own
        // organisation's identical request gets the same 400.
        const bodyRefused =
          res.status === 400 && ownStatus.get(`${c.route.method} ${c.route.template} ${c.who}`) === 400;
        expected = '404 (or the 400 the own organisation gets for the same body)';
        ok = res.status === 404 || bodyRefused;
      } else {
        expected = '2xx-4xx but not 401/403/404';
        ok = res.status < 500 && ![401, 403, 404].includes(res.status);
      }
      const leaks = foreign.tokens.filter((t) => res.text.includes(t));
      if (c.org === 'own') ownStatus.set(`${c.route.method} ${c.route.template} ${c.who}`, res.status);
      outcomes.push({
        line: `${c.route.method} ${c.url} as ${c.who} (${c.org}): ${res.status}, expected ${expected}${leaks.length ? `, shows ${leaks.join(', ')}` : ''}`,
        ok: ok && leaks.length === 0,
      });
    };
    // Changes to the own organisation's subscription go last, so they cannot colour the rest.
    // The own organisation's requests first: the foreign ones are compared with them.
    const billingLast = cases.filter((c) => c.route.template.startsWith('/api/billing/cancel'));
    for (const org of ['own', 'foreign']) {
      const rest = cases.filter((c) => c.org === org && !billingLast.includes(c));
      const workers = Array.from({ length: 4 }, async () => {
        for (let c = rest.shift(); c; c = rest.shift()) await run(c);
      });
      await Promise.all(workers);
    }
    for (const c of billingLast) await run(c);
    const failures = outcomes.filter((o) => !o.ok).map((o) => o.line);
    console.log(
      `route matrix: ${routes.length} route methods in ${new Set(routes.map((r) => r.template)).size} route files × ${ROLES.length} roles + signed-out × own/foreign organisation: ${requests} requests to ${APP_URL}`,
    );
    expect(failures.join('\n')).toBe('');
  }, 600_000);
});
