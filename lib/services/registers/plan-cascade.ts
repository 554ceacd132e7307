import 'server-only';
// Codes that a batch renames or removes are carried into the rows that name them: activity
// predecessors, correlation inputs, a risk's activities and cost lines (stored by code), and (for
// the checks only) the activity codes shown on line items, which are stored as links by id. An
// activity still used by a line item or a risk cannot be removed; a removed line item leaves the
// cost lines of the risks that named it.

import type { FieldIssue } from '@/lib/errors';
import type { RegisterKind } from '@/lib/validation/registers';
import type { NextState } from './checks';

/** `renamed` maps an old code to its new one; `removed` holds codes of deleted rows. */
export type CodeChanges = { renamed: ReadonlyMap<string, string>; removed: ReadonlySet<string> };

export function carryCodes(kind: RegisterKind, next: NextState, changes: CodeChanges): NextState {
  const { renamed, removed } = changes;
  if (renamed.size === 0 && removed.size === 0) return next;
  const code = (c: string) => renamed.get(c) ?? c;
  let { items, risks, activities } = next;
  if (kind === 'activities') {
    activities = activities.map((a) => {
      const links = a.predecessors
        .filter((p) => !removed.has(p.code))
        .map((p) => ({ ...p, code: code(p.code) }));
      const same =
        links.length === a.predecessors.length && links.every((p, i) => p.code === a.predecessors[i].code);
      return same ? a : { ...a, predecessors: links };
    });
    items = items.map((i) =>
      i.activityCode && renamed.has(i.activityCode) ? { ...i, activityCode: code(i.activityCode) } : i,
    );
    risks = risks.map((r) =>
      r.activityCodes.some((c) => renamed.has(c)) ? { ...r, activityCodes: r.activityCodes.map(code) } : r,
    );
  }
  if (kind === 'items') {
    risks = risks.map((r) =>
      r.itemCodes.some((c) => renamed.has(c) || removed.has(c))
        ? { ...r, itemCodes: r.itemCodes.filter((c) => !removed.has(c)).map(code) }
        : r,
    );
  }
  const correlations = next.correlations
    .filter((c) => !removed.has(c.aCode) && !removed.has(c.bCode))
    .map((c) => {
      const a = code(c.aCode);
      const b = code(c.bCode);
      return a === c.aCode && b === c.bCode ? c : { ...c, aCode: a, bCode: b };
    });
  let drivers = next.drivers;
  if (kind === 'items' || kind === 'activities') {
    // Exact codes follow a rename and leave with a removal; branches ("3.*") stay as typed.
    drivers = drivers.map((d) => {
      const applies = d.applies.filter((t) => !removed.has(t)).map(code);
      const same = applies.length === d.applies.length && applies.every((t, i) => t === d.applies[i]);
      return same ? d : { ...d, applies };
    });
  }
  return { items, risks, activities, correlations, drivers };
}

/** Removing an activity that line items or risks still use is refused, naming them. */
export function activityInUse(
  kind: RegisterKind,
  state: NextState,
  removed: ReadonlySet<string>,
): FieldIssue[] {
  if (kind !== 'activities' || removed.size === 0) return [];
  const issues: FieldIssue[] = [];
  for (const code of removed) {
    const users = [
      ...state.items.filter((i) => i.activityCode === code).map((i) => `line ${i.code}`),
      ...state.risks.filter((r) => r.activityCodes.includes(code)).map((r) => `risk ${r.code}`),
    ];
    if (users.length) {
      issues.push({
        path: `activities.${code}`,
        message: `Activity ${code} is used by ${users.slice(0, 6).join(', ')}${users.length > 6 ? ` and ${users.length - 6} more` : ''}; change those first.`,
      });
    }
  }
  return issues;
}
