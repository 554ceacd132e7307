// An audit entry as people read it: what was changed, named by its code (a line item's WBS code,
// a risk's or an activity's code, a run's number in its project), never by an internal id; and
// each changed field in words with its values in their unit, never as raw JSON.
import { FILE_COLUMNS } from '@/lib/registers/columns';
import { distText, fieldWords, formatNumber, formatPercent, valueText } from '@/lib/format';
import type { RegisterKind } from '@/lib/validation/registers';

export type AuditEntryData = {
  entity: string;
  entityId: string | null;
  action: string;
  before: unknown;
  after: unknown;
};

export type AuditText = {
  /** "Changed", "Added", "Removed", "Started"… */
  what: string;
  /** What it was done to: "line item 1.2 Sheet piling", "run 3", "correlation C1–A2". */
  subject: string;
  /** Each changed field: "Low: 80,000 → 85,000"; or the new or removed row's main fields. */
  changes: string[];
};

const REGISTER_OF: Record<string, RegisterKind> = {
  'cost-item': 'items',
  'risk-event': 'risks',
  activity: 'activities',
  correlation: 'correlations',
};

const ENTITY_WORDS: Record<string, string> = {
  'cost-item': 'line item',
  'risk-event': 'risk event',
  activity: 'activity',
  correlation: 'correlation',
  run: 'run',
  brief: 'brief of run',
  approval: 'decision on run',
  project: 'project',
  model: 'registers',
  membership: 'member',
  invitation: 'invitation',
  subscription: 'subscription',
};

const ACTION_WORDS: Record<string, string> = {
  create: 'Added',
  update: 'Changed',
  delete: 'Removed',
  import: 'Imported',
  start: 'Started',
  cancel: 'Cancelled',
  archive: 'Archived',
  restore: 'Restored',
  approved: 'Approved',
  returned: 'Returned',
};

/** The label of a register field as the grids and files head it ("costLow" → "Cost low"). */
function fieldLabel(kind: RegisterKind | undefined, field: string): string {
  const col = kind ? FILE_COLUMNS[kind].find((c) => c.field === field) : undefined;
  if (col) return col.header;
  const words = fieldWords(field);
  return words.charAt(0).toUpperCase() + words.slice(1);
}

function fieldValue(kind: RegisterKind | undefined, field: string, value: unknown): string {
  const col = kind ? FILE_COLUMNS[kind].find((c) => c.field === field) : undefined;
  if (typeof value === 'number') {
    if (col?.kind === 'percent' || field === 'probability') return formatPercent(value);
    return formatNumber(value, 4);
  }
  if (value && typeof value === 'object' && 'type' in value)
    return distText(value as Record<string, unknown>);
  return valueText(value);
}

const obj = (v: unknown): Record<string, unknown> | null =>
  v && typeof v === 'object' && !Array.isArray(v) ? (v as Record<string, unknown>) : null;

/** The code and name a row is known by. */
function rowName(kind: RegisterKind | undefined, row: Record<string, unknown> | null): string {
  if (!row) return '';
  if (kind === 'correlations') return row.aCode ? `${row.aCode}–${row.bCode}` : '';
  const name = row.description ?? row.title ?? row.name;
  return [row.code, name].filter((x) => x !== undefined && x !== null && x !== '').join(' ');
}

/**
 * Describes one entry. `runNumbers` maps a run's internal id to its number in the project, for
 * entries about runs, briefs and decisions.
 */
export function describeAudit(entry: AuditEntryData, runNumbers: ReadonlyMap<number, number>): AuditText {
  const kind = REGISTER_OF[entry.entity];
  const before = obj(entry.before);
  const after = obj(entry.after);
  const what = ACTION_WORDS[entry.action] ?? fieldWords(entry.action).replace(/^./, (c) => c.toUpperCase());
  const noun = ENTITY_WORDS[entry.entity] ?? fieldWords(entry.entity);

  let name = rowName(kind, after) || rowName(kind, before);
  if (entry.entity === 'run' || entry.entity === 'brief' || entry.entity === 'approval') {
    const runId = entry.entity === 'approval' ? Number(after?.runId) : Number(entry.entityId);
    const number = (entry.entity === 'approval' ? Number(after?.runNumber) : NaN) || runNumbers.get(runId);
    name = number ? String(number) : 'no longer listed';
  } else if (entry.entity === 'project') {
    name = String(after?.code ?? before?.code ?? '');
  }
  const subject = [noun, name].filter(Boolean).join(' ');

  const changes: string[] = [];
  if (entry.entity === 'model' || (after && 'format' in after)) {
    changes.push('Registers replaced from a model file');
  } else if (before && after) {
    for (const field of Object.keys({ ...before, ...after })) {
      if (JSON.stringify(before[field]) === JSON.stringify(after[field])) continue;
      changes.push(
        `${fieldLabel(kind, field)}: ${fieldValue(kind, field, before[field])} → ${fieldValue(kind, field, after[field])}`,
      );
    }
  } else if (entry.entity === 'run' && after) {
    const s = after as { iterations?: number; sampling?: string; seed?: number };
    if (s.iterations) changes.push(`${formatNumber(s.iterations, 0)} iterations`);
    if (s.sampling) changes.push(s.sampling === 'lhs' ? 'Latin hypercube' : 'Monte Carlo');
    if (s.seed !== undefined) changes.push(`seed ${s.seed}`);
  } else if (entry.entity === 'approval' && after) {
    if (after.comment) changes.push(`“${String(after.comment)}”`);
  } else if (entry.entity === 'brief' && after && Array.isArray(after.sponsors)) {
    changes.push(`Sent to ${after.sponsors.length} sponsor${after.sponsors.length === 1 ? '' : 's'}`);
  } else if (!kind && (before || after)) {
    const row = (after ?? before)!;
    for (const [field, value] of Object.entries(row)) {
      if (value === null || value === undefined || typeof value === 'object') continue;
      changes.push(`${fieldLabel(kind, field)}: ${fieldValue(kind, field, value)}`);
    }
  } else if (typeof entry.before === 'string' && typeof entry.after === 'string') {
    changes.push(`${entry.before} → ${entry.after}`);
  }
  return { what, subject, changes };
}
