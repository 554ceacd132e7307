// The grids' column description (ours, independent of AG Grid) and how typed or pasted text
// becomes a cell value.

import { formatNumber, readNumber, readProbability } from '@/lib/registers/numbers';
import { formatPredecessors, parsePredecessors, type PredecessorLink } from '@/lib/registers/predecessors';
import { formatCodeList, readCodeList } from '@/lib/registers/risk-fields';
import type { GridRow } from './use-register-rows';

export type CellKind = 'text' | 'number' | 'percent' | 'choice' | 'predecessors' | 'codes' | 'computed';

export type RegisterColumn = {
  field: string;
  header: string;
  kind: CellKind;
  width?: number;
  /**
   * Kept in view while the grid scrolls sideways: codes and names at the left; figures at the
   * right (computed columns are pinned right unless they say otherwise).
   */
  pinned?: 'left' | 'right' | null;
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
  /** Neighbouring columns with the same group sit under one header. */
  group?: string;
  /** In a group: shown only when the group is expanded ('open') or collapsed ('closed'). */
  groupShow?: 'open' | 'closed';
  /** Extra classes of a cell by its row (e.g. a tone that marks an opportunity). */
  cellClass?: (row: GridRow) => string | null;
  /** A cell editor of the register's own (e.g. a multi-pick), with its parameters. */
  editor?: { component: unknown; params?: Record<string, unknown>; popup?: boolean };
};

export function parseCell(col: RegisterColumn, text: unknown): unknown {
  const raw = typeof text === 'string' ? text.trim() : text;
  if (raw === '' || raw === null || raw === undefined)
    return col.kind === 'predecessors' || col.kind === 'codes' ? [] : null;
  switch (col.kind) {
    case 'number':
      return readNumber(raw);
    case 'percent':
      return readProbability(raw);
    case 'choice': {
      const hit = matchOption(col.options ?? [], String(raw));
      return hit ? hit.value : String(raw);
    }
    case 'predecessors': {
      if (Array.isArray(raw)) return raw;
      const parsed = parsePredecessors(String(raw));
      return parsed.ok ? parsed.links : String(raw);
    }
    case 'codes':
      return readCodeList(raw);
    default:
      return String(raw);
  }
}

const normal = (s: string) => s.toLowerCase().replace(/[\s_–-]+/g, '-');

/**
 * The option that typed or pasted text names: its value or label exactly, or else the first
 * whose value or label starts with the text ("tri" → Triangular), as a spreadsheet's list does.
 */
export function matchOption<O extends { value: string | null; label: string }>(
  options: O[],
  text: string,
): O | undefined {
  const s = normal(text.trim());
  if (!s) return undefined;
  const names = (o: O) => [normal(o.value ?? ''), normal(o.label)];
  return (
    options.find((o) => names(o).includes(s)) ??
    options.find((o) => names(o).some((n) => n !== '' && n.startsWith(s)))
  );
}

/** The text a cell shows and its editor starts from. */
export function cellText(col: RegisterColumn, value: unknown, row: GridRow): string {
  if (col.format) return col.format(value, row);
  if (value === null || value === undefined) return '';
  if (col.kind === 'predecessors')
    return Array.isArray(value) ? formatPredecessors(value as PredecessorLink[]) : String(value);
  if (col.kind === 'codes') return formatCodeList(value);
  if (col.kind === 'choice') return col.options?.find((o) => o.value === value)?.label ?? String(value);
  if (col.kind === 'percent' && typeof value === 'number') return `${formatNumber(value * 100, 2)} %`;
  if (typeof value === 'number') return formatNumber(value, 2);
  return String(value);
}

/** A cell as copied to the clipboard: figures in full (no rounding, no separators), the rest as shown. */
export function copyText(col: RegisterColumn, value: unknown, row: GridRow): string {
  if (col.kind === 'number' && typeof value === 'number') return String(value);
  if (col.kind === 'percent' && typeof value === 'number') return `${+(value * 100).toPrecision(12)}%`;
  return cellText(col, value, row);
}
