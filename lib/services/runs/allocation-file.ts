import 'server-only';
// The contingency allocation of a finished run as a file: CSV or XLSX, every row (the screen may
// fold the smallest into one), the sum, the contingency and the Monte Carlo difference.
import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import type { Actor } from '@/lib/auth/actor';
import { conflict } from '@/lib/errors';
import { allocationSheet, allocationTable } from '@/lib/runs/allocation';
import { inputNames } from '@/lib/runs/outcome-data';
import { escapeSpreadsheetText } from '@/lib/registers/spreadsheet-escape';
import { getProject } from '@/lib/services/projects';
import { getRunOutcome } from './runs';

export type AllocationFile = { body: string | Buffer; contentType: string; fileName: string };

const escape = (v: string | number) => (typeof v === 'string' ? escapeSpreadsheetText(v) : v);

export async function allocationFile(
  actor: Actor,
  projectId: number,
  runId: number,
  format: 'csv' | 'xlsx',
): Promise<AllocationFile> {
  const [project, outcome] = await Promise.all([
    getProject(actor, projectId),
    getRunOutcome(actor, projectId, runId),
  ]);
  const allocation = outcome.result.allocation;
  if (!allocation) {
    throw conflict(`Run ${runId} was made before results held the allocation of contingency; run it again.`);
  }
  const names = inputNames(outcome.snapshot);
  const table = allocationTable(allocation, (code) => names[code] ?? '');
  const rows = allocationSheet(table, project.currency).map((r) => r.map(escape));
  const stem = `${project.code}-run-${runId}-allocation-${table.level}`.replace(/[^A-Za-z0-9._-]/g, '_');
  if (format === 'csv') {
    return {
      body: Papa.unparse(rows, { newline: '\r\n' }),
      contentType: 'text/csv; charset=utf-8',
      fileName: `${stem}.csv`,
    };
  }
  const workbook = new ExcelJS.Workbook();
  workbook.creator = 'Outturn';
  const sheet = workbook.addWorksheet(`Allocation ${table.level}`, {
    views: [{ state: 'frozen', ySplit: 1 }],
  });
  for (const r of rows) sheet.addRow(r);
  sheet.getRow(1).font = { bold: true };
  sheet.getRow(rows.length - 2).font = { bold: true };
  sheet.getColumn(4).numFmt = '#,##0';
  sheet.getColumn(5).numFmt = '0.0%';
  [12, 48, 12, 22, 20].forEach((w, i) => (sheet.getColumn(i + 1).width = w));
  return {
    body: Buffer.from(await workbook.xlsx.writeBuffer()),
    contentType: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
    fileName: `${stem}.xlsx`,
  };
}
