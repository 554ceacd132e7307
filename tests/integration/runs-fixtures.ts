// Shared set-up of the runs tests: a project with registers, made through the app's own routes
// (project creation and the model-file import), and a wait for a run to reach a state.
import type { Client } from './helpers/http';

/** A small water-main project: five lines, two risks, a three-activity schedule, one correlation. */
export const FIXTURE_MODEL = {
  format: 'outturn-model',
  version: 1,
  name: 'Runs fixture',
  currency: 'EUR',
  items: [
    {
      id: 'C1',
      name: 'Site set-up',
      dist: { type: 'triangular', low: 180_000, mode: 200_000, high: 260_000 },
    },
    { id: 'C2', name: 'Trenching', dist: { type: 'pert', low: 1_400_000, mode: 1_600_000, high: 2_300_000 } },
    {
      id: 'C3',
      name: 'Pipe supply',
      dist: { type: 'pert', low: 2_000_000, mode: 2_200_000, high: 2_900_000 },
    },
    { id: 'C4', name: 'Reinstatement', dist: { type: 'uniform', low: 300_000, high: 420_000 } },
    { id: 'C5', name: 'Site overheads', ratePerDay: 4_000, activity: 'A2' },
  ],
  risks: [
    {
      id: 'R1',
      name: 'Rock in the trench',
      probability: 0.3,
      cost: { type: 'triangular', low: 100_000, mode: 250_000, high: 600_000 },
      delay: { type: 'triangular', low: 5, mode: 10, high: 25 },
      activity: 'A2',
    },
    {
      id: 'R2',
      name: 'Late pipe delivery',
      probability: 0.2,
      delay: { type: 'uniform', low: 5, high: 15 },
      activity: 'A1',
    },
  ],
  activities: [
    {
      id: 'A1',
      name: 'Procure pipes',
      duration: { type: 'triangular', low: 30, mode: 40, high: 60 },
      predecessors: [],
    },
    {
      id: 'A2',
      name: 'Lay the main',
      duration: { type: 'pert', low: 80, mode: 100, high: 150 },
      predecessors: ['A1'],
    },
    {
      id: 'A3',
      name: 'Reinstate',
      duration: { type: 'triangular', low: 15, mode: 20, high: 30 },
      predecessors: ['A2'],
    },
  ],
  correlations: [{ a: 'C2', b: 'A2', rho: 0.5 }],
};

let counter = 0;

/** Creates a project in the client's organisation and fills its registers from the fixture. */
export async function projectWithRegisters(client: Client, model: object = FIXTURE_MODEL): Promise<number> {
  const code = `RUN${Date.now().toString(36).toUpperCase()}${counter++}`;
  const created = await client.post('/api/projects', {
    name: 'Runs test main',
    code,
    currency: 'EUR',
    estimateClass: 3,
    stage: 'Feasibility',
    baseDate: '2027-03-01',
  });
  if (created.status !== 201) throw new Error(`project not created: ${created.status} ${created.text}`);
  const projectId = created.json.project.id as number;
  const imported = await client.post(`/api/projects/${projectId}/import`, model);
  if (imported.status !== 200) throw new Error(`import failed: ${imported.status} ${imported.text}`);
  return projectId;
}

/** Polls a run until `done(run)` holds, or fails after `timeoutMs`. Returns the last state. */
export async function waitForRun(
  client: Client,
  projectId: number,
  runId: number,
  done: (run: Record<string, any>) => boolean,
  timeoutMs = 60_000,
): Promise<Record<string, any>> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const res = await client.get(`/api/projects/${projectId}/runs/${runId}`);
    if (res.status !== 200) throw new Error(`run status: ${res.status} ${res.text}`);
    if (done(res.json.run)) return res.json.run;
    if (Date.now() > until)
      throw new Error(`run ${runId} still ${res.json.run.status} after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** A run's stored settings, for tests that write run rows straight into the database. */
export const storedRunSettings = (iterations: number, seed: number) => ({
  iterations,
  seed,
  sampling: 'lhs' as const,
  riskValues: 'pre' as const,
  confidence: 'P80' as const,
  costTarget: null,
  finishTarget: null,
  durationTarget: null,
  precision: null,
});
