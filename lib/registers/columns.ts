// The columns of each register in files (CSV, XLSX): header, row field and how to read a cell.
// Exports write these headers; imports map a file's headers onto fields by these names and
// their aliases, so an exported file imports back unchanged.

import type { RegisterKind } from '@/lib/validation/registers';
import { formatPredecessors, parsePredecessors, type PredecessorLink } from './predecessors';
import { readNumber, readProbability } from './numbers';

export type ColumnKind = 'text' | 'number' | 'percent' | 'choice' | 'predecessors';

export type FileColumn = { field: string; header: string; kind: ColumnKind; aliases?: string[] };

const c = (field: string, header: string, kind: ColumnKind = 'text', aliases: string[] = []): FileColumn => ({
  field,
  header,
  kind,
  aliases,
});

const DIST_COLUMNS = [
  c('distType', 'Distribution', 'choice', ['dist', 'type']),
  c('range', 'Range', 'choice', ['low/high are']),
  c('low', 'Low', 'number', ['min', 'p10', 'optimistic']),
  c('mode', 'Most likely', 'number', ['mode', 'ml', 'likely', 'value']),
  c('high', 'High', 'number', ['max', 'p90', 'pessimistic']),
  c('mean', 'Mean', 'number'),
  c('sd', 'SD', 'number', ['standard deviation', 'std dev']),
];

export const FILE_COLUMNS: Record<RegisterKind, FileColumn[]> = {
  items: [
    c('code', 'WBS code', 'text', ['wbs', 'code', 'id', 'item']),
    c('description', 'Description', 'text', ['name', 'item description']),
    c('basis', 'Basis', 'choice'),
    c('activityCode', 'Activity', 'text', ['activity code']),
    ...DIST_COLUMNS,
    c('base', 'Base', 'number', ['base estimate', 'amount', 'base amount']),
    c('ownerName', 'Owner', 'text'),
    c('notes', 'Notes', 'text', ['comment', 'comments']),
  ],
  risks: [
    c('code', 'Code', 'text', ['id', 'risk id', 'risk']),
    c('title', 'Title', 'text', ['name', 'risk title']),
    c('cause', 'Cause'),
    c('event', 'Event'),
    c('effect', 'Effect'),
    c('ownerName', 'Owner'),
    c('status', 'Status', 'choice'),
    c('response', 'Response', 'choice'),
    c('probability', 'Probability', 'percent', ['likelihood', 'p']),
    c('costType', 'Cost distribution', 'choice', ['cost type']),
    c('costLow', 'Cost low', 'number'),
    c('costMode', 'Cost most likely', 'number', ['cost ml', 'cost mode']),
    c('costHigh', 'Cost high', 'number'),
    c('delayType', 'Delay distribution', 'choice', ['delay type']),
    c('delayLow', 'Delay low', 'number'),
    c('delayMode', 'Delay most likely', 'number', ['delay ml', 'delay mode']),
    c('delayHigh', 'Delay high', 'number'),
    c('activityCode', 'Activity', 'text', ['delayed activity']),
    c('mitigationCost', 'Mitigation cost', 'number'),
    c('postProbability', 'Post probability', 'percent', ['post-mitigation probability']),
    c('postCostLow', 'Post cost low', 'number'),
    c('postCostMode', 'Post cost most likely', 'number'),
    c('postCostHigh', 'Post cost high', 'number'),
    c('postDelayLow', 'Post delay low', 'number'),
    c('postDelayMode', 'Post delay most likely', 'number'),
    c('postDelayHigh', 'Post delay high', 'number'),
  ],
  activities: [
    c('code', 'Code', 'text', ['id', 'activity', 'activity code']),
    c('name', 'Name', 'text', ['activity name', 'description']),
    ...DIST_COLUMNS,
    c('predecessors', 'Predecessors', 'predecessors', ['preds', 'depends on']),
    c('existence', 'Existence', 'percent', ['existence probability', 'branch probability']),
  ],
  correlations: [
    c('aCode', 'Input A', 'text', ['a', 'first']),
    c('bCode', 'Input B', 'text', ['b', 'second']),
    c('rho', 'Coefficient', 'number', ['rho', 'correlation', 'r']),
  ],
};

export const SHEET_NAMES: Record<RegisterKind, string> = {
  items: 'Line items',
  risks: 'Risk events',
  activities: 'Schedule',
  correlations: 'Correlations',
};

const norm = (s: string) => s.toLowerCase().replace(/[^a-z0-9]/g, '');

/** For each header of a file, the field it fills (null: ignored). */
export function mapHeaders(kind: RegisterKind, headers: string[]): (string | null)[] {
  const lookup = new Map<string, string>();
  for (const col of FILE_COLUMNS[kind]) {
    for (const name of [col.header, col.field, ...(col.aliases ?? [])]) {
      if (!lookup.has(norm(name))) lookup.set(norm(name), col.field);
    }
  }
  const used = new Set<string>();
  return headers.map((h) => {
    const field = lookup.get(norm(h ?? ''));
    if (!field || used.has(field)) return null;
    used.add(field);
    return field;
  });
}

const CHOICES: Record<string, Record<string, string>> = {
  basis: {
    lumpsum: 'lump-sum',
    lump: 'lump-sum',
    perday: 'per-day',
    timedependent: 'per-day',
    rate: 'per-day',
  },
  range: { minmax: 'min-max', absolute: 'min-max', p10p90: 'p10-p90' },
};

/** A cell as the row schema wants it (numbers as numbers, choices normalised, empty as null). */
export function readCell(col: FileColumn, raw: unknown): unknown {
  if (raw === undefined || raw === null || (typeof raw === 'string' && raw.trim() === '')) {
    return col.kind === 'predecessors' ? [] : null;
  }
  switch (col.kind) {
    case 'number':
      return readNumber(raw);
    case 'percent':
      return readProbability(raw);
    case 'choice': {
      const text = String(raw).trim();
      return CHOICES[col.field]?.[norm(text)] ?? text.toLowerCase();
    }
    case 'predecessors': {
      const parsed = parsePredecessors(String(raw));
      return parsed.ok ? parsed.links : String(raw);
    }
    default:
      return String(raw).trim();
  }
}

/** A row field as a file cell. */
export function writeCell(col: FileColumn, value: unknown): string | number | null {
  if (value === null || value === undefined) return null;
  if (col.kind === 'predecessors') return formatPredecessors(value as PredecessorLink[]);
  if (typeof value === 'number') return value;
  return String(value);
}
