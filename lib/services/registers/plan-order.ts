import 'server-only';
// A register's new order: rows named in `order` (by id, or by a new row's client key) come
// first in that order, the rest keep theirs. Rows whose place changes are copied with their new
// sortOrder; the others are returned as they were, so that a comparison finds only the moved.

type Placed = { id: number; sortOrder: number; key?: string };

export function reorder<R extends Placed>(rows: R[], order: (number | string)[]): R[] {
  const byRef = new Map<number | string, R>();
  for (const r of rows) {
    if (r.id) byRef.set(r.id, r);
    if (r.key) byRef.set(r.key, r);
  }
  const placed = new Set<R>();
  const out: R[] = [];
  for (const ref of order) {
    const r = byRef.get(ref);
    if (r && !placed.has(r)) {
      placed.add(r);
      out.push(r);
    }
  }
  for (const r of rows) if (!placed.has(r)) out.push(r);
  return out.map((r, i) => (r.sortOrder === i ? r : { ...r, sortOrder: i }));
}
