import 'server-only';
// Rules across rows that a single row's schema cannot see: unique codes (across the registers,
// since codes are the model file's ids), links to activities, the activity network (no unknown
// predecessor, no cycle), what drivers apply to, and correlations between known inputs.

import { checkNetwork, existenceInput } from '@/lib/sim';
import type { FieldIssue } from '@/lib/errors';
import type { RegisterKind } from '@/lib/validation/registers';
import { resolveApplies } from '@/lib/registers/driver-applies';
import type { ActivityRow, CorrelationRow, DriverRow, LineItemRow, RiskRow } from './rows';
import { REGISTER_LABEL } from './kinds';

export type NextState = {
  items: LineItemRow[];
  risks: RiskRow[];
  activities: ActivityRow[];
  correlations: CorrelationRow[];
  drivers: DriverRow[];
};

/** `where(kind, row)` names a row in messages and paths ("rows[3]" for a row of the batch). */
export type RowLocator = (kind: RegisterKind, row: object) => { path: string; label: string } | null;

export function crossCheck(
  next: NextState,
  touched: ReadonlySet<RegisterKind>,
  where: RowLocator,
): FieldIssue[] {
  const issues: FieldIssue[] = [];
  const add = (kind: RegisterKind, row: object, field: string, message: string) => {
    const at = where(kind, row);
    const code = (row as { code?: string }).code;
    issues.push({
      path: at ? `${at.path}.${field}` : `${kind}.${code ?? '?'}.${field}`,
      message: `${at ? at.label : `The ${REGISTER_LABEL[kind]} ${code ?? ''}`.trim()}, ${field}: ${message}`,
    });
  };

  const owner = new Map<string, RegisterKind>();
  for (const kind of ['activities', 'items', 'risks', 'drivers'] as const) {
    for (const row of next[kind]) {
      const prev = owner.get(row.code);
      if (prev && (touched.has(kind) || touched.has(prev))) {
        add(
          kind,
          row,
          'code',
          `${row.code} is already the code of ${prev === kind ? 'another' : 'a'} ${REGISTER_LABEL[prev]}; codes are unique in a project.`,
        );
      } else owner.set(row.code, kind);
    }
  }
  const activityCodes = new Set(next.activities.map((a) => a.code));
  // A branch's existence can be correlated like a risk.
  for (const a of next.activities) if (a.existence !== null) owner.set(existenceInput(a.code), 'activities');

  if (touched.has('items') || touched.has('activities')) {
    for (const row of next.items) {
      if (row.basis === 'per-day' && row.activityCode && !activityCodes.has(row.activityCode)) {
        add('items', row, 'activityCode', `unknown activity "${row.activityCode}".`);
      }
    }
  }
  if (touched.has('risks') || touched.has('activities') || touched.has('items')) {
    const itemCodes = new Set(next.items.map((i) => i.code));
    for (const row of next.risks) {
      const unknownActivity = row.activityCodes.find((c) => !activityCodes.has(c));
      if (unknownActivity) add('risks', row, 'activityCodes', `unknown activity "${unknownActivity}".`);
      const unknownItem = row.itemCodes.find((c) => !itemCodes.has(c));
      if (unknownItem) add('risks', row, 'itemCodes', `unknown line item "${unknownItem}".`);
    }
  }
  if (touched.has('drivers') || touched.has('items') || touched.has('activities')) {
    driverTargetIssues(next, touched, add);
  }
  if (touched.has('activities')) {
    const problems = checkNetwork(
      next.activities.map((a) => ({
        id: a.code,
        duration: { type: 'fixed', value: 0 },
        predecessors: a.predecessors.map((p) => ({ id: p.code, type: p.type, lag: p.lag })),
      })),
    );
    for (const p of problems) {
      const row = next.activities[Number(p.path[1])];
      if (row) add('activities', row, 'predecessors', `${p.message}.`);
    }
  }
  if (touched.has('correlations') || touched.size > 0) {
    const pairs = new Set<string>();
    for (const row of next.correlations) {
      for (const f of ['aCode', 'bCode'] as const) {
        if (!owner.has(row[f])) add('correlations', row, f, `unknown input "${row[f]}".`);
      }
      const key = [row.aCode, row.bCode].sort().join('\u0000');
      if (pairs.has(key))
        add('correlations', row, 'bCode', `the pair ${row.aCode}–${row.bCode} is already given.`);
      pairs.add(key);
    }
  }
  return issues;
}

/**
 * A driver's codes must name line items or activities, and each branch must cover at least one.
 * When only lines or activities change, a driver is named only if it would be left covering
 * nothing (a removed code is carried out of its list; see plan-cascade.ts).
 */
function driverTargetIssues(
  next: NextState,
  touched: ReadonlySet<RegisterKind>,
  add: (kind: RegisterKind, row: object, field: string, message: string) => void,
) {
  const targets = { items: next.items.map((i) => i.code), activities: next.activities.map((a) => a.code) };
  const others = new Set([...next.risks, ...next.drivers].map((r) => r.code));
  for (const row of next.drivers) {
    const { codes, problems } = resolveApplies(row.applies, targets, others);
    if (touched.has('drivers')) for (const p of problems) add('drivers', row, 'applies', p.message);
    else if (codes.length === 0)
      add(
        'drivers',
        row,
        'applies',
        'would apply to no line item or activity after this change; change the driver first.',
      );
  }
}
