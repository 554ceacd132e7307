import 'server-only';
// An .xlsx file is a zip archive, and a zip of a few hundred kilobytes can unpack to gigabytes.
// Its central directory (the archive's table of contents, read by unzipper's Open.buffer without
// inflating anything) states each part's uncompressed size: a workbook with too many parts or too
// much unpacked data is refused before it is parsed. A forged directory that understates the sizes
// is caught by the memory cap of the worker that parses the workbook (./xlsx-worker.ts).

import { createRequire } from 'node:module';
import path from 'node:path';
import { badRequest, tooLarge } from '@/lib/errors';

/** A register of 20,000 rows takes some 60 parts and well under 50 MB unpacked. */
export const MAX_XLSX_ENTRIES = 200;
export const MAX_XLSX_ENTRY_BYTES = 40 * 1024 * 1024;
export const MAX_XLSX_TOTAL_BYTES = 50 * 1024 * 1024;

type CentralDirectory = { files: { path: string; uncompressedSize: number }[] };
type Unzipper = { Open: { buffer(buffer: Buffer): Promise<CentralDirectory> } };

/** Loaded from node_modules at run time (as exceljs, which depends on it), never bundled. */
export const requireFromApp = createRequire(path.join(process.cwd(), 'package.json'));

const mb = (bytes: number) => `${(bytes / 1048576).toFixed(1)} MB`;

export async function assertXlsxArchive(bytes: ArrayBuffer): Promise<void> {
  const unzipper = requireFromApp('unzipper') as Unzipper;
  let directory: CentralDirectory;
  try {
    directory = await unzipper.Open.buffer(Buffer.from(bytes));
  } catch {
    throw badRequest('The file is not a readable XLSX workbook.', [
      { path: 'file', message: 'Not an XLSX workbook.' },
    ]);
  }
  const { files } = directory;
  if (files.length > MAX_XLSX_ENTRIES) {
    throw tooLarge(
      `The workbook has ${files.length} parts; workbooks of up to ${MAX_XLSX_ENTRIES} parts are accepted.`,
    );
  }
  const largest = files.reduce((a, b) => (b.uncompressedSize > a.uncompressedSize ? b : a), files[0]);
  const total = files.reduce((sum, f) => sum + f.uncompressedSize, 0);
  if (total > MAX_XLSX_TOTAL_BYTES) {
    throw tooLarge(
      `The workbook unpacks to ${mb(total)}; workbooks up to ${mb(MAX_XLSX_TOTAL_BYTES).replace('.0', '')} unpacked are accepted. Split it, or save it as CSV.`,
    );
  }
  if (largest && largest.uncompressedSize > MAX_XLSX_ENTRY_BYTES) {
    throw tooLarge(
      `The workbook's part ${largest.path} unpacks to ${mb(largest.uncompressedSize)}; parts up to ${mb(MAX_XLSX_ENTRY_BYTES).replace('.0', '')} are accepted.`,
    );
  }
}
