import 'server-only';
// Register files: CSV (papaparse) and XLSX (exceljs), read into header + cell rows and written
// from register rows. Exported text cells are escaped against formula injection.

import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import { badRequest, tooLarge } from '@/lib/errors';
import { FILE_COLUMNS, SHEET_NAMES, writeCell } from '@/lib/registers/columns';
import { escapeSpreadsheetText, unescapeSpreadsheetText } from '@/lib/registers/spreadsheet-escape';
import { REGISTER_KINDS, type RegisterKind } from '@/lib/validation/registers';
import { assertXlsxArchive } from './xlsx-archive';
import { parseXlsxInWorker, type RawSheet } from './xlsx-worker';

export const MAX_FILE_BYTES = 10 * 1024 * 1024;
export const MAX_FILE_ROWS = 20_000;

export type FileFormat = 'csv' | 'xlsx';
export type Table = { kind: RegisterKind; sheet: string; headers: string[]; rows: unknown[][] };

export function formatOf(fileName: string): FileFormat | 'json' {
  const lower = fileName.toLowerCase();
  if (lower.endsWith('.csv') || lower.endsWith('.txt')) return 'csv';
  if (lower.endsWith('.xlsx')) return 'xlsx';
  if (lower.endsWith('.json')) return 'json';
  throw badRequest(`${fileName}: upload a .csv, .xlsx or model .json file.`, [
    { path: 'file', message: 'Use a .csv, .xlsx or .json file.' },
  ]);
}

export function assertSize(bytes: number) {
  if (bytes > MAX_FILE_BYTES) {
    throw tooLarge(`The file is ${(bytes / 1048576).toFixed(1)} MB; files up to 10 MB are accepted.`);
  }
}

function assertRows(sheet: string, n: number) {
  if (n > MAX_FILE_ROWS) {
    throw badRequest(
      `${sheet} has ${n.toLocaleString('en-GB')} rows; up to 20,000 rows are accepted in one import.`,
      [{ path: 'file', message: 'Split the file: at most 20,000 rows.' }],
    );
  }
}

const blank = (row: unknown[]) => row.every((v) => v === null || v === undefined || String(v).trim() === '');
const text = (v: unknown) => (typeof v === 'string' ? unescapeSpreadsheetText(v) : v);

export function readCsv(content: string, kind: RegisterKind): Table {
  const parsed = Papa.parse<string[]>(content.replace(/^\uFEFF/, ''), { skipEmptyLines: 'greedy' });
  const [headers = [], ...rows] = parsed.data;
  assertRows('The file', rows.length);
  return {
    kind,
    sheet: 'CSV',
    headers: headers.map((h) => String(h).trim()),
    rows: rows.map((r) => r.map(text)),
  };
}

/**
 * Sheets of a workbook: the one named after `kind` (or the first), or every known one for 'all'.
 * The archive is checked before it is inflated, and parsed in a worker with a memory cap.
 */
export async function readXlsx(buffer: ArrayBuffer, kind: RegisterKind | 'all'): Promise<Table[]> {
  await assertXlsxArchive(buffer);
  const worksheets = await parseXlsxInWorker(buffer);
  const byName = new Map(worksheets.map((w) => [w.name.trim().toLowerCase(), w]));
  const picks: [RegisterKind, RawSheet][] = [];
  if (kind === 'all') {
    for (const k of REGISTER_KINDS) {
      const w = byName.get(SHEET_NAMES[k].toLowerCase());
      if (w) picks.push([k, w]);
    }
    if (!picks.length) {
      throw badRequest(
        `The workbook has none of the sheets ${REGISTER_KINDS.map((k) => `"${SHEET_NAMES[k]}"`).join(', ')}.`,
      );
    }
  } else {
    const w = byName.get(SHEET_NAMES[kind].toLowerCase()) ?? worksheets[0];
    if (!w) throw badRequest('The workbook has no sheet.');
    picks.push([kind, w]);
  }
  return picks.map(([k, sheet]) => {
    const all = sheet.rows.map((values) => values.map(text));
    const [headers = [], ...rows] = all.filter((r) => !blank(r));
    assertRows(`Sheet "${sheet.name}"`, rows.length);
    return { kind: k, sheet: sheet.name, headers: headers.map((h) => String(h ?? '').trim()), rows };
  });
}

type Cell = string | number | null;

function tableOf(kind: RegisterKind, rows: Record<string, unknown>[]): Cell[][] {
  const cols = FILE_COLUMNS[kind];
  const escape = (v: Cell) => (typeof v === 'string' ? escapeSpreadsheetText(v) : v);
  return [cols.map((c) => c.header), ...rows.map((r) => cols.map((c) => escape(writeCell(c, r[c.field]))))];
}

export function writeCsv(kind: RegisterKind, rows: Record<string, unknown>[]): string {
  return Papa.unparse(tableOf(kind, rows), { newline: '\r\n' });
}

export async function writeXlsx(
  registers: Partial<Record<RegisterKind, Record<string, unknown>[]>>,
): Promise<Buffer> {
  const workbook = new ExcelJS.Workbook();
  workbook.creator = 'Outturn';
  for (const kind of REGISTER_KINDS) {
    const rows = registers[kind];
    if (!rows) continue;
    const sheet = workbook.addWorksheet(SHEET_NAMES[kind], { views: [{ state: 'frozen', ySplit: 1 }] });
    for (const r of tableOf(kind, rows)) sheet.addRow(r);
    sheet.getRow(1).font = { bold: true };
    sheet.columns.forEach((col, i) => (col.width = i < 2 ? 24 : 14));
  }
  return Buffer.from(await workbook.xlsx.writeBuffer());
}
