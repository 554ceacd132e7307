'use client';
// The workspace tabs of one project; the current one is marked for screen readers too.
import Link from 'next/link';
import { usePathname } from 'next/navigation';

const TABS = [
  { href: 'items', label: 'Line items' },
  { href: 'risks', label: 'Risk events' },
  { href: 'drivers', label: 'Drivers' },
  { href: 'schedule', label: 'Schedule' },
  { href: 'correlations', label: 'Correlations' },
  { href: 'runs', label: 'Runs' },
  { href: 'trend', label: 'Trend' },
  { href: 'audit', label: 'Audit trail' },
];

export function ProjectTabs({ projectId }: { projectId: number }) {
  const path = usePathname();
  return (
    <nav className="flex gap-1 border-b border-rule" aria-label="Project">
      {TABS.map((t) => {
        const href = `/projects/${projectId}/${t.href}`;
        const current = path === href || path.startsWith(`${href}/`);
        return (
          <Link
            key={t.href}
            href={href}
            aria-current={current ? 'page' : undefined}
            className={`-mb-px border-b-2 px-3 py-1.5 text-sm ${current ? 'border-cost font-semibold text-ink' : 'border-transparent text-ink-soft hover:text-ink'}`}
          >
            {t.label}
          </Link>
        );
      })}
    </nav>
  );
}
