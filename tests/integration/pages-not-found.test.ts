// Pages of another organisation's project or run, and pages with an unknown or malformed id,
// answer with a real HTTP 404 status (not a 200 that carries a not-found page), and never show
// the record; the owner still gets 200 for the same addresses.
import { beforeAll, describe, expect, it } from 'vitest';
import { newOrganisation, type Client } from './helpers/http';
import { projectWithRegisters, waitForRun } from './runs-fixtures';

const TABS = ['items', 'risks', 'schedule', 'correlations', 'audit', 'decisions', 'trend', 'runs'];

let owner: Client;
let stranger: Client;
let projectId: number;
let runId: number;
let projectName: string;

beforeAll(async () => {
  owner = (await newOrganisation('pages-owner')).client;
  stranger = (await newOrganisation('pages-stranger')).client;
  projectId = await projectWithRegisters(owner);
  projectName = (await owner.get(`/api/projects/${projectId}`)).json.project.name;
  const started = await owner.post(`/api/projects/${projectId}/runs`, { iterations: 2000, seed: 3 });
  expect(started.status).toBe(201);
  runId = started.json.run.id;
  await waitForRun(owner, projectId, runId, (r) => r.status === 'succeeded');
});

describe('the status of a page that must not be shown', () => {
  it("answers 404 for every tab of another organisation's project, and 200 to its owner", async () => {
    for (const tab of TABS) {
      const path = `/projects/${projectId}/${tab}`;
      const foreign = await stranger.get(path);
      expect(foreign.status, path).toBe(404);
      expect(foreign.text).not.toContain(projectName);
      expect((await owner.get(path)).status, path).toBe(200);
    }
  });

  it("answers 404 for another organisation's run, its brief and a comparison of its runs", async () => {
    for (const below of ['', '/brief']) {
      const path = `/projects/${projectId}/runs/${runId}${below}`;
      expect((await stranger.get(path)).status, path).toBe(404);
      expect((await owner.get(path)).status, path).toBe(200);
    }
    const compare = `/projects/${projectId}/runs/compare?a=${runId}&b=${runId + 1}`;
    expect((await stranger.get(compare)).status).toBe(404);
  });

  it('answers 404 for an unknown or a malformed id of a project or a run', async () => {
    const paths = [
      '/projects/not-a-number/items',
      '/projects/12abc/runs',
      '/projects/999999999/items',
      `/projects/${projectId}/runs/not-a-number`,
      `/projects/${projectId}/runs/not-a-number/brief`,
      `/projects/${projectId}/runs/999999999`,
      `/projects/${projectId}/runs/compare?a=x&b=y`,
    ];
    for (const path of paths) expect((await owner.get(path)).status, path).toBe(404);
  });

  it('serves the favicon as an image', async () => {
    const res = await fetch(new URL('/favicon.ico', process.env.APP_URL ?? 'http://localhost:3100'));
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toMatch(/^image\//);
  });
});
