import 'server-only';
// Parses an .xlsx upload in a worker thread with a memory cap and a time limit, off the request
// thread: a workbook that needs more than the cap ends the worker, never the server. The worker
// runs plain JavaScript and loads exceljs from node_modules (exceljs is not bundled, see
// next.config.mjs), so it needs no build step of its own.

import { Worker } from 'node:worker_threads';
import { badRequest, tooLarge } from '@/lib/errors';
import { requireFromApp } from './xlsx-archive';

/** Heap of the parsing worker: a 20,000-row register parses in well under half of it. */
export const XLSX_WORKER_HEAP_MB = 512;
export const XLSX_WORKER_TIMEOUT_MS = 60_000;

export type RawSheet = { name: string; rows: unknown[][] };

// Cell values as text, numbers, ISO dates or null: formulas give their result, rich text its text.
const SOURCE = `
const { parentPort, workerData } = require('node:worker_threads');
const ExcelJS = require(workerData.exceljs);
function cell(v) {
  if (v === null || v === undefined) return null;
  if (v instanceof Date) return v.toISOString().slice(0, 10);
  if (typeof v === 'object') {
    if ('result' in v) return cell(v.result);
    if ('richText' in v) return v.richText.map((t) => t.text).join('');
    if ('text' in v) return v.text;
    if ('error' in v) return null;
  }
  return v;
}
(async () => {
  const workbook = new ExcelJS.Workbook();
  try {
    await workbook.xlsx.load(workerData.bytes);
  } catch {
    parentPort.postMessage({ unreadable: true });
    return;
  }
  const sheets = workbook.worksheets.map((sheet) => {
    const rows = [];
    sheet.eachRow({ includeEmpty: false }, (row) => rows.push(Array.from(row.values.slice(1), cell)));
    return { name: sheet.name, rows };
  });
  parentPort.postMessage({ sheets });
})();
`;

export function parseXlsxInWorker(
  bytes: ArrayBuffer,
  limits: { heapMb: number } = { heapMb: XLSX_WORKER_HEAP_MB },
): Promise<RawSheet[]> {
  const tooBig = () =>
    tooLarge(
      `The workbook needs more than ${limits.heapMb} MB of memory or ${XLSX_WORKER_TIMEOUT_MS / 1000} s to read. Split it, or save it as CSV.`,
    );
  return new Promise((resolve, reject) => {
    const worker = new Worker(SOURCE, {
      eval: true,
      workerData: { bytes: new Uint8Array(bytes), exceljs: requireFromApp.resolve('exceljs') },
      resourceLimits: {
        maxOldGenerationSizeMb: limits.heapMb,
        maxYoungGenerationSizeMb: Math.min(64, limits.heapMb),
      },
    });
    let settled = false;
    const settle = (fn: () => void) => {
      if (settled) return;
      settled = true;
      clearTimeout(timer);
      void worker.terminate();
      fn();
    };
    const timer = setTimeout(() => settle(() => reject(tooBig())), XLSX_WORKER_TIMEOUT_MS);
    worker.on('message', (m: { unreadable?: boolean; sheets?: RawSheet[] }) =>
      settle(() =>
        m.sheets
          ? resolve(m.sheets)
          : reject(
              badRequest('The file is not a readable XLSX workbook.', [
                { path: 'file', message: 'Not an XLSX workbook.' },
              ]),
            ),
      ),
    );
    worker.on('error', (e: Error & { code?: string }) =>
      settle(() => reject(e.code === 'ERR_WORKER_OUT_OF_MEMORY' ? tooBig() : e)),
    );
    worker.on('exit', () => settle(() => reject(tooBig())));
  });
}
