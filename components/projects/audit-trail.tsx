// Who changed what and when: each entry names what it changed by its code (never an internal
// id) and lists the fields that changed from before to after, in words and units.
import type { AuditView } from '@/lib/view-types/audit';
import { formatDateTime } from '@/lib/format';
import { EmptyState } from '@/components/ui/card';
import { TableHead } from '@/components/ui/table';

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
      <TableHead look="banded" cells={['When', 'Who', 'What', 'Change']} />
      <tbody>
        {entries.map((e) => (
          <tr key={e.id} className="border-t border-rule align-top">
            <td className="num whitespace-nowrap px-3 py-1.5 text-left">{formatDateTime(e.at)}</td>
            <td className="px-3 py-1.5">{e.who}</td>
            <td className="px-3 py-1.5">
              {e.what} {e.subject}
            </td>
            <td className="px-3 py-1.5 text-xs text-ink-soft">
              {e.changes.length ? (
                <ul className="space-y-0.5">
                  {e.changes.map((c, i) => (
                    <li key={i}>{c}</li>
                  ))}
                </ul>
              ) : null}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
