// Who changed what and when, with the fields that changed from before to after.
import type { AuditView } from '@/lib/view-types/audit';
import { EmptyState } from '@/components/ui/card';
import { TableHead } from '@/components/ui/table';

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
      <TableHead look="banded" cells={['When (UTC)', 'Who', 'What', 'Change']} />
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
