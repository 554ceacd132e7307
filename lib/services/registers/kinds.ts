import 'server-only';
// What the registers are called: in the audit trail, in messages, and by the key that
// names a row (its code, or the pair of codes of a correlation). Pure: no model is loaded.

import type { RegisterKind } from '@/lib/validation/registers';

export const ENTITY: Record<RegisterKind, string> = {
  items: 'cost-item',
  risks: 'risk-event',
  activities: 'activity',
  correlations: 'correlation',
  drivers: 'risk-driver',
};

export const REGISTER_LABEL: Record<RegisterKind, string> = {
  items: 'line item',
  risks: 'risk event',
  activities: 'activity',
  correlations: 'correlation',
  drivers: 'risk driver',
};

type Named = { code?: unknown; aCode?: unknown; bCode?: unknown };

/** The code a row is known by (a pair for correlations). */
export function rowCode(kind: RegisterKind, row: Named): string {
  return kind === 'correlations' ? `${row.aCode}–${row.bCode}` : String(row.code);
}

/** The key that is unique in a project: the code, or the unordered pair of a correlation. */
export function matchKey(kind: RegisterKind, row: object): string {
  const r: Named = row;
  return kind === 'correlations' ? [String(r.aCode), String(r.bCode)].sort().join('\u0000') : String(r.code);
}
