// Which register a file's columns describe. A file chosen on the wrong tab (a line-items sheet
// dropped on the risk register) is named for what it looks like, in one message, rather than
// refused row by row for the fields it lacks.

import type { RegisterKind } from '@/lib/validation/registers';
import { FILE_COLUMNS, SHEET_NAMES, mapHeaders } from './columns';

/** The columns every row of a register needs: a file without them cannot fill that register. */
const REQUIRED: Record<RegisterKind, string[]> = {
  items: ['code', 'description'],
  risks: ['code', 'title'],
  activities: ['code', 'name'],
  correlations: ['aCode', 'bCode', 'rho'],
  drivers: ['code', 'name', 'applies'],
};

const KINDS = Object.keys(REQUIRED) as RegisterKind[];

export const REGISTER_NOUNS: Record<RegisterKind, string> = {
  items: 'line items',
  risks: 'risk events',
  activities: 'schedule',
  correlations: 'correlations',
  drivers: 'drivers',
};

const headerOf = (kind: RegisterKind, field: string) =>
  FILE_COLUMNS[kind].find((c) => c.field === field)?.header ?? field;

/** How many of the headers name a column of `kind`, and whether the required ones are there. */
function fit(kind: RegisterKind, headers: string[]) {
  const fields = new Set(mapHeaders(kind, headers).filter((f): f is string => f !== null));
  return { count: fields.size, complete: REQUIRED[kind].every((f) => fields.has(f)) };
}

/** The register a table's headers (and sheet name) fit best, or null when none fits. */
export function likelyKind(headers: string[], sheet?: string): RegisterKind | null {
  const named = KINDS.find((k) => sheet && SHEET_NAMES[k].toLowerCase() === sheet.trim().toLowerCase());
  const complete = KINDS.map((k) => ({ k, ...fit(k, headers) })).filter((f) => f.complete);
  if (named && complete.some((f) => f.k === named)) return named;
  complete.sort((a, b) => b.count - a.count);
  return complete[0]?.k ?? null;
}

/**
 * Why a table cannot fill `kind`, in one sentence naming what it looks like instead, or null
 * when its columns fit. A table that has the required columns of `kind` but fits another
 * register far better (a schedule's "Code, Name" also reads as a risk's code and title) is
 * named for the other register too.
 */
export function wrongKindMessage(kind: RegisterKind, headers: string[], sheet?: string): string | null {
  const own = fit(kind, headers);
  const where = sheet && sheet !== 'CSV' ? `Sheet "${sheet}"` : 'The file';
  const other = likelyKind(headers, sheet);
  const better = other && other !== kind ? fit(other, headers).count : 0;
  if (own.complete && better <= own.count + 1) return null;
  if (other && other !== kind) {
    return `${where} looks like a ${REGISTER_NOUNS[other]} file (columns ${describe(headers)}), not ${REGISTER_NOUNS[kind]}: import it on the ${SHEET_NAMES[other]} tab. Nothing was imported.`;
  }
  const missing = REQUIRED[kind]
    .filter((f) => !mapHeaders(kind, headers).includes(f))
    .map((f) => headerOf(kind, f));
  return `${where} has no ${missing.join(' or ')} column, which every row of the ${REGISTER_NOUNS[kind]} needs. Its first row should name the columns, e.g. ${FILE_COLUMNS[
    kind
  ]
    .slice(0, 4)
    .map((c) => c.header)
    .join(', ')}. Nothing was imported.`;
}

/** The first few headers, quoted, for a message. */
function describe(headers: string[]): string {
  const shown = headers.filter((h) => h.trim()).slice(0, 5);
  const more = headers.length > shown.length ? ', …' : '';
  return shown.map((h) => `"${h}"`).join(', ') + more;
}
