// The grids' column description (ours, independent of AG Grid) and how typed or pasted text
// becomes a cell value.

import { formatNumber, readNumber, readProbability } from '@/lib/registers/numbers';
import { formatPredecessors, parsePredecessors, type PredecessorLink } from '@/lib/registers/predecessors';
import type { GridRow } from './use-register-rows';

export type CellKind = 'text' | 'number' | 'percent' | 'choice' | 'predecessors' | 'computed';

export type RegisterColumn = {
  field: string;
  header: string;
  kind: CellKind;
  width?: number;
  pinned?: 'left';
  /** For choices: the values, with labels to show. */
  options?: { value: string | null; label: string }[];
  /** Whether the cell takes a value in this row (e.g. Mean only for normal distributions). */
  applies?: (row: GridRow) => boolean;
  /** Computed cells: the value to show. */
  value?: (row: GridRow) => number | string | null;
  format?: (value: unknown, row: GridRow) => string;
  /** Indent (in levels) of the cell's text, for WBS codes. */
  indent?: (row: GridRow) => number;
  headerTooltip?: string;
};

export function parseCell(col: RegisterColumn, text: unknown): unknown {
  const raw = typeof text === 'string' ? text.trim() : text;
  if (raw === '' || raw === null || raw === undefined) return col.kind === 'predecessors' ? [] : null;
  switch (col.kind) {
    case 'number':
      return readNumber(raw);
    case 'percent':
      return readProbability(raw);
    case 'choice': {
      const s = String(raw)
        .toLowerCase()
        .replace(/[\s_–]+/g, '-');
      const hit = col.options?.find(
        (o) => (o.value ?? '').toLowerCase() === s || o.label.toLowerCase().replace(/[\s_–]+/g, '-') === s,
      );
      return hit ? hit.value : String(raw);
    }
    case 'predecessors': {
      if (Array.isArray(raw)) return raw;
      const parsed = parsePredecessors(String(raw));
      return parsed.ok ? parsed.links : String(raw);
    }
    default:
      return String(raw);
  }
}

/** The text a cell shows and its editor starts from. */
export function cellText(col: RegisterColumn, value: unknown, row: GridRow): string {
  if (col.format) return col.format(value, row);
  if (value === null || value === undefined) return '';
  if (col.kind === 'predecessors')
    return Array.isArray(value) ? formatPredecessors(value as PredecessorLink[]) : String(value);
  if (col.kind === 'choice') return col.options?.find((o) => o.value === value)?.label ?? String(value);
  if (col.kind === 'percent' && typeof value === 'number') return `${formatNumber(value * 100, 2)} %`;
  if (typeof value === 'number') return formatNumber(value, 2);
  return String(value);
}
