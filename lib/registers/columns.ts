// The columns of each register in files (CSV, XLSX): header, row field and how to read a cell.
// Exports write these headers; imports map a file's headers onto fields by these names and
// their aliases, so an exported file imports back unchanged.

import type { RegisterKind } from '@/lib/validation/registers';
import { formatPredecessors, parsePredecessors, type PredecessorLink } from './predecessors';
import { readNumber, readProbability } from './numbers';
import { formatCodeList, readCodeList } from './risk-fields';

export type ColumnKind = 'text' | 'number' | 'percent' | 'choice' | 'predecessors' | 'list' | 'codes';

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
    c('costMean', 'Cost mean', 'number'),
    c('costSd', 'Cost SD', 'number', ['cost standard deviation']),
    c('delayType', 'Delay distribution', 'choice', ['delay type']),
    c('delayLow', 'Delay low', 'number'),
    c('delayMode', 'Delay most likely', 'number', ['delay ml', 'delay mode']),
    c('delayHigh', 'Delay high', 'number'),
    c('delayMean', 'Delay mean', 'number'),
    c('delaySd', 'Delay SD', 'number', ['delay standard deviation']),
    c('activityCodes', 'Activities', 'codes', ['activity', 'delayed activity', 'activity code', 'delays']),
    c('itemCodes', 'Cost lines', 'codes', ['wbs lines', 'line items', 'items']),
    c('sizes', 'Sizes', 'choice', ['cost and delay sizes']),
    c('mitigationType', 'Mitigation cost distribution', 'choice', ['mitigation type']),
    c('mitigationLow', 'Mitigation cost low', 'number'),
    c('mitigationCost', 'Mitigation cost', 'number', ['mitigation cost most likely']),
    c('mitigationHigh', 'Mitigation cost high', 'number'),
    c('postProbability', 'Post probability', 'percent', ['post-mitigation probability']),
    c('postCostLow', 'Post cost low', 'number'),
    c('postCostMode', 'Post cost most likely', 'number'),
    c('postCostHigh', 'Post cost high', 'number'),
    c('postCostMean', 'Post cost mean', 'number'),
    c('postCostSd', 'Post cost SD', 'number'),
    c('postDelayLow', 'Post delay low', 'number'),
    c('postDelayMode', 'Post delay most likely', 'number'),
    c('postDelayHigh', 'Post delay high', 'number'),
    c('postDelayMean', 'Post delay mean', 'number'),
    c('postDelaySd', 'Post delay SD', 'number'),
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
  // Factor cells hold factors (0.95); text such as "-5%" is read as a percentage change.
  drivers: [
    c('code', 'Code', 'text', ['id', 'driver', 'driver id']),
    c('name', 'Name', 'text', ['driver name', 'title']),
    c('standsFor', 'Stands for', 'text', ['description', 'what it stands for', 'meaning']),
    c('probability', 'Probability', 'percent', ['likelihood', 'p']),
    c('distType', 'Distribution', 'choice', ['dist', 'type']),
    c('range', 'Range', 'choice', ['low/high are']),
    c('entry', 'Entered as', 'choice', ['entry']),
    c('low', 'Factor low', 'text', ['low', 'min', 'p10']),
    c('mode', 'Factor most likely', 'text', ['most likely', 'mode', 'ml', 'value']),
    c('high', 'Factor high', 'text', ['high', 'max', 'p90']),
    c('applies', 'Applies to', 'list', ['applies', 'scope', 'items and activities']),
  ],
};

export const SHEET_NAMES: Record<RegisterKind, string> = {
  items: 'Line items',
  risks: 'Risk events',
  activities: 'Schedule',
  correlations: 'Correlations',
  drivers: 'Drivers',
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
    peractivityday: 'per-day',
    timedependent: 'per-day',
    rate: 'per-day',
    perprojectday: 'per-project-day',
    projectday: 'per-project-day',
  },
  range: { minmax: 'min-max', absolute: 'min-max', p10p90: 'p10-p90' },
  entry: { change: 'change', percent: 'change', percentagechange: 'change', factor: 'factor' },
};

/** A cell as the row schema wants it (numbers as numbers, choices normalised, empty as null). */
export function readCell(col: FileColumn, raw: unknown): unknown {
  if (raw === undefined || raw === null || (typeof raw === 'string' && raw.trim() === '')) {
    return col.kind === 'predecessors' || col.kind === 'codes' ? [] : null;
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
    case 'codes':
      return readCodeList(raw);
    default:
      return String(raw).trim();
  }
}

/** A row field as a file cell. */
export function writeCell(col: FileColumn, value: unknown): string | number | null {
  if (value === null || value === undefined) return null;
  if (col.kind === 'predecessors') return formatPredecessors(value as PredecessorLink[]);
  if (col.kind === 'list' && Array.isArray(value)) return value.join(', ');
  if (col.kind === 'codes') return Array.isArray(value) && value.length === 0 ? null : formatCodeList(value);
  if (typeof value === 'number') return value;
  return String(value);
}
