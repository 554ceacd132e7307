import 'server-only';
// Importing a register from a CSV or XLSX file: a preview (the columns mapped, each row's
// problems) and then a commit of every row in one transaction. Rows update the saved row with
// the same code, or are added.

import { sequelize } from '@/models';
import type { Actor } from '@/lib/auth/actor';
import { can } from '@/lib/auth/roles';
import { badRequest, forbidden, type FieldIssue } from '@/lib/errors';
import { FILE_COLUMNS, mapHeaders, readCell } from '@/lib/registers/columns';
import { wrongKindMessage } from '@/lib/registers/detect-kind';
import { parsePredecessors } from '@/lib/registers/predecessors';
import { rowIssues, type RegisterKind } from '@/lib/validation/registers';
import { findProject } from '../projects';
import { assertWritable } from '../write-access';
import { applyBatch, summarise, type ParsedBatch } from './batch';
import { assertSize, formatOf, readCsv, readXlsx, type Table } from './files';
import { loadState } from './state';
import { parseRows } from '@/lib/validation/registers';

export type UploadedFile = { name: string; bytes: ArrayBuffer };

export type SheetPreview = {
  kind: RegisterKind;
  sheet: string;
  columns: { header: string; field: string | null }[];
  total: number;
  valid: number;
  invalid: number;
  creates: number;
  updates: number;
  /** The first rows, and every row with a problem (up to 500). */
  rows: { line: number; values: Record<string, unknown>; issues: Record<string, string> }[];
};

const PREVIEW_ROWS = 50;
const MAX_LISTED_PROBLEMS = 500;

export async function readTables(file: UploadedFile, kind: RegisterKind | 'all'): Promise<Table[]> {
  const tables = await readFileTables(file, kind);
  // A file meant for another register is named for what it looks like, once, not row by row.
  for (const table of tables) {
    const wrong = wrongKindMessage(table.kind, table.headers, table.sheet);
    if (wrong) throw badRequest(wrong, [{ path: 'file', message: wrong }]);
  }
  return tables;
}

async function readFileTables(file: UploadedFile, kind: RegisterKind | 'all'): Promise<Table[]> {
  assertSize(file.bytes.byteLength);
  const format = formatOf(file.name);
  if (format === 'json') throw badRequest('A .json file is a model file: import it as the whole project.');
  if (format === 'csv') {
    if (kind === 'all')
      throw badRequest('A CSV file holds one register: choose which one.', [
        { path: 'register', message: 'Choose a register.' },
      ]);
    return [readCsv(new TextDecoder().decode(file.bytes), kind)];
  }
  return readXlsx(file.bytes, kind);
}

function rowsOf(table: Table) {
  const fields = mapHeaders(table.kind, table.headers);
  const columns = FILE_COLUMNS[table.kind];
  return table.rows.map((cells) => {
    const values: Record<string, unknown> = {};
    const issues: Record<string, string> = {};
    fields.forEach((field, i) => {
      if (!field) return;
      const col = columns.find((c) => c.field === field)!;
      values[field] = readCell(col, cells[i]);
      if (col.kind === 'predecessors' && typeof values[field] === 'string') {
        const parsed = parsePredecessors(String(values[field]));
        if (!parsed.ok) issues[field] = parsed.error;
      }
    });
    return { values, issues: { ...rowIssues(table.kind, values), ...issues } };
  });
}

function keyOf(kind: RegisterKind, v: Record<string, unknown>) {
  return kind === 'correlations' ? [v.aCode, v.bCode].map(String).sort().join('\u0000') : String(v.code);
}

export async function previewImport(
  actor: Actor,
  projectId: number,
  file: UploadedFile,
  kind: RegisterKind | 'all',
): Promise<{ sheets: SheetPreview[] }> {
  if (!can(actor.role, 'project:write')) throw forbidden();
  const project = await findProject(actor, projectId);
  const tables = await readTables(file, kind);
  const state = await loadState(project.id, actor.organizationId);
  return {
    sheets: tables.map((table) => {
      const fields = mapHeaders(table.kind, table.headers);
      const rows = rowsOf(table);
      const existing = new Set(
        (state[table.kind] as Record<string, unknown>[]).map((r) => keyOf(table.kind, r)),
      );
      const invalid = rows.filter((r) => Object.keys(r.issues).length > 0).length;
      const updates = rows.filter((r) => existing.has(keyOf(table.kind, r.values))).length;
      const listed = rows
        .map((r, i) => ({ line: i + 2, ...r }))
        .filter((r, i) => i < PREVIEW_ROWS || Object.keys(r.issues).length > 0)
        .slice(0, PREVIEW_ROWS + MAX_LISTED_PROBLEMS);
      return {
        kind: table.kind,
        sheet: table.sheet,
        columns: table.headers.map((header, i) => ({ header, field: fields[i] })),
        total: rows.length,
        valid: rows.length - invalid,
        invalid,
        creates: rows.length - updates,
        updates,
        rows: listed,
      };
    }),
  };
}

export async function commitImport(
  actor: Actor,
  projectId: number,
  file: UploadedFile,
  kind: RegisterKind | 'all',
): Promise<{ sheets: { kind: RegisterKind; sheet: string; created: number; updated: number }[] }> {
  if (!can(actor.role, 'project:write')) throw forbidden();
  const project = await findProject(actor, projectId);
  const tables = await readTables(file, kind);
  const issues: FieldIssue[] = [];
  const batches = tables.map((table) => {
    const rows = rowsOf(table);
    const label = (i: number) => `${table.sheet}, line ${i + 2}`;
    rows.forEach((r, i) => {
      for (const [field, message] of Object.entries(r.issues)) {
        const code = r.values.code ?? (r.values.aCode ? `${r.values.aCode}–${r.values.bCode}` : '');
        issues.push({
          path: `${table.kind}[${i}].${field}`,
          message: `${label(i)}${code ? ` (${code})` : ''}, ${field}: ${message}`,
        });
      }
    });
    const parsed = parseRows(
      table.kind,
      rows.map((r) => r.values),
      label,
    );
    return { table, label, upserts: parsed.data as unknown as ParsedBatch['upserts'] };
  });
  if (issues.length) throw badRequest(`Nothing was imported. ${summarise(issues)}`, issues);
  await assertWritable(actor.organizationId);
  // Activities first: line items and risks name them.
  const ordered = [...batches].sort((a, b) => RANK[a.table.kind] - RANK[b.table.kind]);
  return sequelize.transaction(async (transaction) => {
    const sheets = [];
    for (const b of ordered) {
      const result = await applyBatch(
        { actor, projectId: project.id },
        b.table.kind,
        { upserts: b.upserts, deletes: [] },
        {
          matchByCode: true,
          label: (i, row) =>
            `${b.label(i)}${(row as { code?: string }).code ? ` (${(row as { code?: string }).code})` : ''}`,
          auditAction: 'import',
        },
        transaction,
      );
      sheets.push({
        kind: b.table.kind,
        sheet: b.table.sheet,
        created: result.created,
        updated: result.updated,
      });
    }
    return { sheets };
  });
}

// Drivers after the lines and activities they name; correlations last (they may name drivers).
const RANK: Record<RegisterKind, number> = { activities: 0, items: 1, risks: 2, drivers: 3, correlations: 4 };
