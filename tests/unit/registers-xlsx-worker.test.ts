// The worker that parses an .xlsx upload: it gives the sheets' cells, and a workbook that needs
// more memory than its cap ends the worker with a 413 instead of growing the server. A forged
// archive that understates its unpacked size in its directory reaches this cap.
import { describe, expect, it } from 'vitest';
import ExcelJS from 'exceljs';
import { parseXlsxInWorker } from '@/lib/services/registers/xlsx-worker';
import { assertXlsxArchive } from '@/lib/services/registers/xlsx-archive';
import type { AppError } from '@/lib/errors';

async function workbook(rows: number): Promise<ArrayBuffer> {
  const book = new ExcelJS.Workbook();
  const sheet = book.addWorksheet('Line items');
  sheet.addRow(['WBS code', 'Description', 'Most likely']);
  for (let i = 0; i < rows; i++) sheet.addRow([`C${i}`, `Line ${i}`, i]);
  sheet.getCell('D2').value = new Date(Date.UTC(2027, 0, 4));
  sheet.getCell('E2').value = { formula: '1+1', result: 2 };
  const buffer = await book.xlsx.writeBuffer();
  return buffer as ArrayBuffer;
}

describe('parsing an .xlsx upload in a worker', () => {
  it('gives each sheet’s cells: text, numbers, dates as ISO days, formula results', async () => {
    const [sheet] = await parseXlsxInWorker(await workbook(2));
    expect(sheet.name).toBe('Line items');
    expect(sheet.rows).toEqual([
      ['WBS code', 'Description', 'Most likely'],
      ['C0', 'Line 0', 0, '2027-01-04', 2],
      ['C1', 'Line 1', 1],
    ]);
  });

  it('ends a worker that needs more memory than its cap with a 413', async () => {
    const big = await workbook(30_000);
    // The archive itself is within the limits: only the memory cap stands in the way.
    await expect(assertXlsxArchive(big)).resolves.toBeUndefined();
    const refused = await parseXlsxInWorker(big, { heapMb: 8 }).catch((e: AppError) => e);
    expect(refused).toMatchObject({ status: 413, code: 'too_large' });
    expect((refused as AppError).message).toMatch(/needs more than 8 MB of memory/);
    // The same workbook parses under the server's cap.
    expect((await parseXlsxInWorker(big))[0].rows).toHaveLength(30_001);
  });

  it('refuses a file that is not a zip archive as unreadable', async () => {
    await expect(assertXlsxArchive(new TextEncoder().encode('not a workbook').buffer)).rejects.toMatchObject({
      status: 400,
    });
  });
});
