import Link from 'next/link';
import { Brand } from '@/components/ui/brand';
import { can, ROLE_LABELS } from '@/lib/auth/roles';
import type { Actor } from '@/lib/auth/actor';
import { landingPath } from '@/lib/auth/landing';
import { SignOutButton } from './sign-out-button';

export function WorkspaceNav({ actor, organizationName }: { actor: Actor; organizationName: string }) {
  const links = [
    can(actor.role, 'project:read') && { href: '/projects', label: 'Projects' },
    can(actor.role, 'members:manage') && { href: '/settings/members', label: 'Members' },
    can(actor.role, 'organization:manage') && { href: '/settings/organization', label: 'Organisation' },
    can(actor.role, 'project:read') && { href: '/settings/calendar', label: 'Calendar' },
    can(actor.role, 'billing:read') && { href: '/settings/billing', label: 'Billing and seats' },
    { href: '/settings/notifications', label: 'Notices' },
  ].filter(Boolean) as { href: string; label: string }[];
  return (
    <header className="no-print border-b border-rule bg-paper-raised">
      <div className="mx-auto flex max-w-[1400px] items-center gap-6 px-5 py-2">
        <Brand href={landingPath(actor.role)} />
        <span className="text-sm text-ink-faint">{organizationName}</span>
        <nav className="flex gap-1" aria-label="Workspace">
          {links.map((l) => (
            <Link
              key={l.href}
              href={l.href}
              className="rounded px-2.5 py-1 text-sm text-ink-soft hover:bg-paper-sunk hover:text-ink"
            >
              {l.label}
            </Link>
          ))}
        </nav>
        <div className="ml-auto flex items-center gap-3 text-sm">
          <span data-testid="signed-in-as">
            {actor.name} <span className="text-ink-faint">· {ROLE_LABELS[actor.role]}</span>
          </span>
          <SignOutButton />
        </div>
      </div>
    </header>
  );
}
