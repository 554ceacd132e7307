/**
 * A project with a succeeded run, for the brief's integration and end-to-end tests. The
 * registers go straight into the test database (their API is not what these tests are about);
 * the run goes through the real runs API and the real engine, polled until it succeeds.
 */
import { QueryTypes, Sequelize } from 'sequelize';
import type { Client } from '../../integration/helpers/http';
import { testDatabase } from '../../integration/helpers/db';

let db: Sequelize | undefined;
function connection() {
  db ??= testDatabase();
  return db;
}

export async function closeFixtureDb() {
  await db?.close();
  db = undefined;
}

const ITEMS = [
  {
    code: 'C1',
    description: 'Sheet piling',
    dist: { type: 'pert', low: 3_800_000, mode: 4_200_000, high: 5_400_000 },
  },
  {
    code: 'C2',
    description: 'Capping beam',
    dist: { type: 'triangular', low: 900_000, mode: 1_000_000, high: 1_400_000 },
  },
  { code: 'C3', description: 'Dredging', dist: { type: 'uniform', low: 600_000, high: 950_000 } },
];
export const FIXTURE_RISKS = [
  {
    code: 'R1',
    title: 'Contaminated silt',
    probability: 0.3,
    cost: { type: 'triangular', low: 200_000, mode: 400_000, high: 900_000 },
  },
  {
    code: 'R2',
    title: 'Permit conditions',
    probability: 0.5,
    cost: { type: 'uniform', low: 20_000, high: 80_000 },
  },
  {
    code: 'R3',
    title: 'Storm damage',
    probability: 0.1,
    cost: { type: 'pert', low: 100_000, mode: 250_000, high: 600_000 },
  },
];

async function insert(table: string, row: Record<string, unknown>) {
  const cols = Object.keys(row);
  await connection().query(
    `INSERT INTO \`${table}\` (${cols.map((c) => `\`${c}\``).join(', ')}) VALUES (${cols.map(() => '?').join(', ')})`,
    { replacements: Object.values(row), type: QueryTypes.INSERT },
  );
}

/** Two activities in sequence, about 90 + 55 working days: enough for a finish date and its S-curve. */
const ACTIVITIES = [
  {
    code: 'A1',
    name: 'Cofferdam and piling',
    duration: { type: 'pert', low: 70, mode: 90, high: 130 },
    predecessors: [],
  },
  {
    code: 'A2',
    name: 'Capping and fit-out',
    duration: { type: 'triangular', low: 45, mode: 55, high: 80 },
    predecessors: [{ code: 'A1', lag: 0 }],
  },
];

/**
 * Creates a project (as `owner`, an owner or estimator) with three items and three risks, and with
 * `schedule` two activities.
 */
export async function projectWithRegisters(owner: Client, label = 'Harbour wall', { schedule = false } = {}) {
  const code = `HW-${Math.random().toString(36).slice(2, 8).toUpperCase()}`;
  const created = await owner.post('/api/projects', {
    name: `${label} ${code}`,
    code,
    currency: 'EUR',
    estimateClass: 3,
    stage: 'Feasibility',
    baseDate: '2026-01-05',
  });
  if (created.status !== 201) throw new Error(`project not created: ${created.status} ${created.text}`);
  const projectId = created.json.project.id as number;
  const [{ organizationId }] = await connection().query<{ organizationId: number }>(
    'SELECT organizationId FROM Projects WHERE id = ?',
    { replacements: [projectId], type: QueryTypes.SELECT },
  );
  const now = new Date();
  let order = 0;
  for (const item of ITEMS)
    await insert('CostItems', {
      organizationId,
      projectId,
      code: item.code,
      description: item.description,
      dist: JSON.stringify(item.dist),
      sortOrder: order++,
      version: 1,
      createdAt: now,
      updatedAt: now,
    });
  for (const risk of FIXTURE_RISKS)
    await insert('RiskEvents', {
      organizationId,
      projectId,
      code: risk.code,
      title: risk.title,
      status: 'open',
      response: 'reduce',
      probability: risk.probability,
      costImpact: JSON.stringify(risk.cost),
      sortOrder: order++,
      version: 1,
      createdAt: now,
      updatedAt: now,
    });
  if (schedule)
    for (const a of ACTIVITIES)
      await insert('Activities', {
        organizationId,
        projectId,
        code: a.code,
        name: a.name,
        duration: JSON.stringify(a.duration),
        predecessors: JSON.stringify(a.predecessors),
        sortOrder: order++,
        version: 1,
        createdAt: now,
        updatedAt: now,
      });
  return { projectId, code, organizationId };
}

/** Starts a small run through the runs API and waits until it has succeeded. */
export async function succeededRun(
  client: Client,
  projectId: number,
  settings: Record<string, unknown> = {},
) {
  const started = await client.post(`/api/projects/${projectId}/runs`, {
    iterations: 2000,
    seed: 11,
    costTarget: 7_500_000,
    ...settings,
  });
  if (started.status !== 201 && started.status !== 202 && started.status !== 200)
    throw new Error(`run not started: ${started.status} ${started.text}`);
  const runId = (started.json.run?.id ?? started.json.id) as number;
  const deadline = Date.now() + 60_000;
  for (;;) {
    const res = await client.get(`/api/projects/${projectId}/runs/${runId}`);
    const status = res.json?.run?.status;
    if (status === 'succeeded') return runId;
    if (status === 'failed' || status === 'cancelled') throw new Error(`run ${runId} ${status}: ${res.text}`);
    if (Date.now() > deadline) throw new Error(`run ${runId} still ${status} after 60 s`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** The stored result of a run, read from the database as the brief reads it. */
export async function storedResult(runId: number) {
  const [row] = await connection().query<{ result: string }>(
    'SELECT result FROM SimulationRuns WHERE id = ?',
    {
      replacements: [runId],
      type: QueryTypes.SELECT,
    },
  );
  return JSON.parse(row.result) as {
    cost: {
      base: number;
      percentiles: Record<string, number>;
      percentileCI95: Record<string, [number, number]>;
    };
  };
}
