import { requirePageActor } from '@/lib/auth/guard';
import { organizationName } from '@/lib/services/accounts';
import { WorkspaceNav } from '@/components/layout/workspace-nav';
import { Providers } from '@/components/layout/providers';

export default async function WorkspaceLayout({ children }: { children: React.ReactNode }) {
  const actor = await requirePageActor();
  return (
    <Providers>
      <WorkspaceNav actor={actor} organizationName={await organizationName(actor.organizationId)} />
      <main className="mx-auto max-w-[1400px] px-5 py-5">{children}</main>
    </Providers>
  );
}
