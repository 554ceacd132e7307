// Which fields an audited change really changed. An update whose `after` agrees with its
// `before` on every field it names changed nothing and is not worth an entry in the trail:
// the trail records what someone did, not a save that left everything as it was.

/** Field values compared as stored: empty text, null and absent are all "none"; object keys in any order. */
function stable(value: unknown): string {
  return (
    JSON.stringify(value === '' ? null : (value ?? null), (_key, v) =>
      v && typeof v === 'object' && !Array.isArray(v) && !(v instanceof Date)
        ? Object.fromEntries(Object.entries(v).sort(([x], [y]) => (x < y ? -1 : x > y ? 1 : 0)))
        : v,
    ) ?? 'null'
  );
}

const isRecord = (v: unknown): v is Record<string, unknown> =>
  typeof v === 'object' && v !== null && !Array.isArray(v);

/** The fields of `after` whose value differs from `before` (after may name only the fields sent). */
export function changedFields(before: unknown, after: unknown): string[] {
  if (!isRecord(before) || !isRecord(after)) return [];
  return Object.keys(after).filter((k) => stable(before[k]) !== stable(after[k]));
}

/** Whether an audit entry records a change: any entry but an update that changed no field. */
export function recordsAChange(change: { action: string; before: unknown; after: unknown }): boolean {
  if (change.action !== 'update') return true;
  if (!isRecord(change.before) || !isRecord(change.after)) return true;
  return changedFields(change.before, change.after).length > 0;
}
