// An XLSX upload is a zip archive: a few hundred kilobytes can hold gigabytes of sheet XML.
// The archive's central directory is read before anything is inflated, and a workbook whose
// entries or uncompressed sizes exceed the limits is refused with a 413; nothing is written.
import { beforeAll, describe, expect, it } from 'vitest';
import ExcelJS from 'exceljs';
import JSZip from 'jszip';
import { APP_URL, newOrganisation, type Client } from './helpers/http';
import { count } from './helpers/db';

let client: Client;
let projectId: number;

beforeAll(async () => {
  ({ client } = await newOrganisation('xlsx-bomb'));
  const created = await client.post('/api/projects', {
    name: 'Bomb test',
    code: 'BOMB-1',
    currency: 'EUR',
    estimateClass: 3,
    stage: 'Feasibility',
    baseDate: '2027-01-04',
  });
  projectId = created.json.project.id;
});

async function upload(data: Uint8Array, mode: 'preview' | 'commit') {
  const form = new FormData();
  form.set('file', new Blob([data as BlobPart]), 'lines.xlsx');
  form.set('register', 'items');
  form.set('mode', mode);
  const cookies = (client as unknown as { cookies: Map<string, string> }).cookies;
  const res = await fetch(`${APP_URL}/api/projects/${projectId}/import`, {
    method: 'POST',
    body: form,
    headers: { cookie: [...cookies].map(([k, v]) => `${k}=${v}`).join('; ') },
  });
  return { status: res.status, json: (await res.json()) as { error: { code: string; message: string } } };
}

/** A real workbook with one line, whose sheet XML is then padded with `rows` identical rows. */
async function bomb(rows: number, extraEntries = 0): Promise<Uint8Array> {
  const workbook = new ExcelJS.Workbook();
  const sheet = workbook.addWorksheet('Line items');
  sheet.addRow(['WBS code', 'Description', 'Distribution', 'Most likely']);
  sheet.addRow(['C1', 'Earthworks', 'fixed', 1000]);
  const zip = await JSZip.loadAsync(await workbook.xlsx.writeBuffer());
  const path = 'xl/worksheets/sheet1.xml';
  const xml = await zip.file(path)!.async('string');
  const row =
    '<row><c t="inlineStr"><is><t>C2</t></is></c><c t="inlineStr"><is><t>Padding</t></is></c></row>';
  zip.file(path, xml.replace('</sheetData>', `${row.repeat(rows)}</sheetData>`));
  for (let i = 0; i < extraEntries; i++) zip.file(`xl/padding/${i}.xml`, '<a/>');
  return zip.generateAsync({ type: 'uint8array', compression: 'DEFLATE', compressionOptions: { level: 9 } });
}

describe('an XLSX decompression bomb', () => {
  it('is refused with a 413 before it is inflated, and nothing is written', async () => {
    // ~1.5 million rows: some 150 MB of sheet XML in well under a megabyte of upload.
    const data = await bomb(1_500_000);
    expect(data.byteLength).toBeLessThan(1024 * 1024);
    for (const mode of ['preview', 'commit'] as const) {
      const res = await upload(data, mode);
      expect(res.status).toBe(413);
      expect(res.json.error.code).toBe('too_large');
      expect(res.json.error.message).toMatch(
        /unpacks to \d+(\.\d)? MB; workbooks up to 50 MB unpacked are accepted/,
      );
    }
    expect(await count('CostItems', 'projectId = ?', [projectId])).toBe(0);
  });

  it('is refused when it holds too many entries', async () => {
    const res = await upload(await bomb(0, 250), 'commit');
    expect(res.status).toBe(413);
    expect(res.json.error.message).toMatch(/has 2\d\d parts; workbooks of up to 200 parts are accepted/);
    expect(await count('CostItems', 'projectId = ?', [projectId])).toBe(0);
  });

  it('leaves an ordinary workbook to be imported', async () => {
    const res = await upload(await bomb(0), 'commit');
    expect(res.status, JSON.stringify(res.json)).toBe(200);
    expect(await count('CostItems', 'projectId = ?', [projectId])).toBe(1);
  });
});
