// Who changed what and when, with the fields that changed from before to after.
import type { AuditView } from '@/lib/view-types/audit';
import { EmptyState } from '@/components/ui/card';

const show = (v: unknown) =>
  v === null || v === undefined
    ? '—'
    : Array.isArray(v)
      ? JSON.stringify(v)
      : typeof v === 'object'
        ? JSON.stringify(v)
        : String(v);

function changes(before: unknown, after: unknown): string {
  if (before && after && typeof before === 'object' && typeof after === 'object') {
    const b = before as Record<string, unknown>;
    const a = after as Record<string, unknown>;
    if ('format' in a) return 'Registers replaced from a model file';
    const diff = Object.keys({ ...b, ...a }).filter((k) => JSON.stringify(b[k]) !== JSON.stringify(a[k]));
    return diff.length
      ? diff.map((k) => `${k}: ${show(b[k])} → ${show(a[k])}`).join(' · ')
      : 'No field changed';
  }
  const row = (after ?? before) as Record<string, unknown> | null;
  if (!row || typeof row !== 'object') return '';
  return ['code', 'description', 'title', 'name', 'aCode', 'bCode', 'rho']
    .filter((k) => k in row)
    .map((k) => `${k}: ${show(row[k])}`)
    .join(' · ');
}

export function AuditTrail({ entries }: { entries: AuditView[] }) {
  if (!entries.length)
    return (
      <EmptyState title="No changes yet">
        Every change to this project’s registers is recorded here.
      </EmptyState>
    );
  return (
    <table
      className="w-full border-collapse rounded border border-rule bg-paper-raised text-sm"
      aria-label="Audit trail"
    >
      <thead className="bg-paper-sunk text-left text-xs uppercase tracking-wide text-ink-soft">
        <tr>
          <th className="px-3 py-2">When (UTC)</th>
          <th className="px-3 py-2">Who</th>
          <th className="px-3 py-2">What</th>
          <th className="px-3 py-2">Change</th>
        </tr>
      </thead>
      <tbody>
        {entries.map((e) => (
          <tr key={e.id} className="border-t border-rule align-top">
            <td className="num whitespace-nowrap px-3 py-1.5 text-left">
              {e.at.replace('T', ' ').slice(0, 19)}
            </td>
            <td className="px-3 py-1.5">{e.who}</td>
            <td className="whitespace-nowrap px-3 py-1.5">
              {e.action} {e.entity}{' '}
              {e.entityId ? <span className="text-ink-faint">#{e.entityId}</span> : null}
            </td>
            <td className="px-3 py-1.5 text-xs text-ink-soft">{changes(e.before, e.after)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
