// The brief as a PDF and as JSON: generated on the server, with the stored result's figures.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PDFParse } from 'pdf-parse';
import { addMember, APP_URL, newOrganisation, type Client } from './helpers/http';
import { closeFixtureDb, projectWithRegisters, storedResult, succeededRun } from '../e2e/pages/brief-fixture';
import { formatMoney } from '@/lib/runs/format';

let owner: Client;
let sponsor: Client;
let projectId: number;
let runId: number;

async function pdfText(bytes: Uint8Array) {
  const parser = new PDFParse({ data: bytes });
  try {
    return (await parser.getText()).text;
  } finally {
    await parser.destroy();
  }
}

/** Fetches with the sponsor's cookies but keeps the body as bytes (the client reads text). */
async function fetchPdf(client: Client, path: string) {
  const cookie = (client as unknown as { cookies: Map<string, string> }).cookies;
  const res = await fetch(APP_URL + path, {
    headers: { cookie: [...cookie].map(([k, v]) => `${k}=${v}`).join('; ') },
  });
  return { res, bytes: new Uint8Array(await res.arrayBuffer()) };
}

beforeAll(async () => {
  const org = await newOrganisation('brief-pdf');
  owner = org.client;
  sponsor = (await addMember(owner, 'sponsor')).client;
  ({ projectId } = await projectWithRegisters(owner));
  const { version } = (await owner.get(`/api/projects/${projectId}/notes`)).json.notes;
  const notes = await owner.put(`/api/projects/${projectId}/notes`, {
    version,
    assumptions: 'Steel prices as of the base date.',
    exclusions: 'Land purchase and legal fees.',
  });
  expect(notes.status).toBe(200);
  runId = await succeededRun(owner, projectId);
});

afterAll(closeFixtureDb);

describe('the brief PDF', () => {
  it('is generated on the server and contains the stored P80, its interval and the notes', async () => {
    const { res, bytes } = await fetchPdf(sponsor, `/api/projects/${projectId}/brief/${runId}/pdf`);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    expect(res.headers.get('content-disposition')).toMatch(/attachment; filename="HW-.*-run-\d+-brief\.pdf"/);
    expect(Buffer.from(bytes.subarray(0, 5)).toString()).toBe('%PDF-');
    expect(res.status).toBe(200);
    const text = await pdfText(bytes);
    const result = await storedResult(runId);
    const p80 = formatMoney(result.cost.percentiles.P80, 'EUR');
    const [lo, hi] = result.cost.percentileCI95.P80.map((v) => formatMoney(v, 'EUR'));
    expect(text).toContain(`P80 ${p80} ${lo} – ${hi}`);
    expect(text).toContain(formatMoney(result.cost.base, 'EUR'));
    expect(text).toContain('Steel prices as of the base date.');
    expect(text).toContain('Land purchase and legal fees.');
    expect(text).toContain('R1 Contaminated silt');
    expect(text).toContain('Read these figures with care');
    // The headline sentence of the page is printed too, naming the scenario and the targets
    // (read with its line breaks folded).
    const flat = text.replace(/\s+/g, ' ');
    expect(flat).toContain('Funding at P80 (before any risk response) means a budget of');
    expect(flat).toContain('chance of staying within the cost target of €7,500,000');
    expect(flat).toContain('No finish target was given');
    expect(text).toContain('ESTIMATE-CLASS CHECK (CLASS 3)');
    expect(flat).toMatch(/Verdict (narrower than|within|wider than) the class/);
  });

  it('comes on A4 by default and on US Letter when asked', async () => {
    // Page sizes in PostScript points: A4 595.28 × 841.89, Letter 612 × 792 (ISO 216; ANSI/ASME Y14.1).
    const a4 = await fetchPdf(sponsor, `/api/projects/${projectId}/brief/${runId}/pdf`);
    expect(Buffer.from(a4.bytes).toString('latin1')).toMatch(/\/MediaBox \[0 0 595\.28 841\.89\]/);
    const letter = await fetchPdf(sponsor, `/api/projects/${projectId}/brief/${runId}/pdf?paper=letter`);
    expect(Buffer.from(letter.bytes).toString('latin1')).toMatch(/\/MediaBox \[0 0 612 792\]/);
  });

  it('is refused to a billing member (403) and to the signed-out (401)', async () => {
    const billing = (await addMember(owner, 'billing')).client;
    expect((await billing.get(`/api/projects/${projectId}/brief/${runId}/pdf`)).status).toBe(403);
    const anonymous = await fetch(`${APP_URL}/api/projects/${projectId}/brief/${runId}/pdf`);
    expect(anonymous.status).toBe(401);
  });
});

describe('the brief data', () => {
  it('ranks the run’s risk events by probability × mean cost impact', async () => {
    const res = await sponsor.get(`/api/projects/${projectId}/brief/${runId}`);
    expect(res.status).toBe(200);
    const risks = res.json.brief.topRisks as { id: string; expectedCost: number }[];
    // Means: triangular (a+b+c)/3, PERT (a+4m+b)/6, uniform (a+b)/2 (Johnson, Kotz & Balakrishnan).
    // R1 0.3 × 500,000 = 150,000; R3 0.1 × 283,333 = 28,333; R2 0.5 × 50,000 = 25,000.
    expect(risks.map((r) => r.id)).toEqual(['R1', 'R3', 'R2']);
    expect(risks[0].expectedCost).toBeCloseTo(150_000, 6);
    expect(res.json.brief.classCheck.estimateClass).toBe(3);
    expect(res.json.brief.contingency.level).toBe('P80');
    expect(res.json.brief.cost.target.value).toBe(7_500_000);
  });

  it('answers 409 for a run that has not succeeded', async () => {
    const started = await owner.post(`/api/projects/${projectId}/runs`, { iterations: 10_000_000, seed: 3 });
    const id = started.json.run.id;
    const cancelled = await owner.post(`/api/projects/${projectId}/runs/${id}/cancel`);
    expect(cancelled.status).toBe(200);
    expect(cancelled.json.run.status).not.toBe('succeeded');
    const res = await sponsor.get(`/api/projects/${projectId}/brief/${id}`);
    expect(res.status).toBe(409);
    expect(res.json.error.message).toMatch(/no result/);
  });
});

describe('assumptions and exclusions', () => {
  it('are edited by estimators and owners only, and checked', async () => {
    expect((await sponsor.put(`/api/projects/${projectId}/notes`, { assumptions: 'x' })).status).toBe(403);
    const { version } = (await owner.get(`/api/projects/${projectId}/notes`)).json.notes;
    const tooLong = await owner.put(`/api/projects/${projectId}/notes`, {
      version,
      assumptions: 'a'.repeat(8001),
    });
    expect(tooLong.status).toBe(400);
    expect(tooLong.json.error.issues[0].path).toBe('assumptions');
    const read = await sponsor.get(`/api/projects/${projectId}/notes`);
    expect(read.json.notes.assumptions).toBe('Steel prices as of the base date.');
  });
});
