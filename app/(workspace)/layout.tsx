import { requirePageActor } from '@/lib/auth/guard';
import { organizationName } from '@/lib/services/accounts';
import { WorkspaceNav } from '@/components/layout/workspace-nav';
import { Providers } from '@/components/layout/providers';
import { ReadOnlyBanner } from '@/components/billing/read-only-banner';
import { organizationAccess } from '@/lib/services/write-access';
import { can } from '@/lib/auth/roles';

export default async function WorkspaceLayout({ children }: { children: React.ReactNode }) {
  const actor = await requirePageActor();
  return (
    <Providers>
      <WorkspaceNav actor={actor} organizationName={await organizationName(actor.organizationId)} />
      <ReadOnlyBanner
        access={await organizationAccess(actor.organizationId)}
        canManageBilling={can(actor.role, 'billing:manage')}
      />
      <main className="mx-auto max-w-[1400px] px-5 py-5">{children}</main>
    </Providers>
  );
}
