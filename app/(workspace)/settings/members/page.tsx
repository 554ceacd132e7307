import { requirePageActor } from '@/lib/auth/guard';
import { listInvitations, listMembers } from '@/lib/services/members';
import { MembersPanel } from '@/components/members/members-panel';
import { QueryPrefill } from '../../query-prefill';

export const metadata = { title: 'Members' };

export default async function MembersPage() {
  const actor = await requirePageActor('members:manage', '/settings/members');
  const [members, invitations] = await Promise.all([listMembers(actor), listInvitations(actor)]);
  return (
    <div className="max-w-4xl space-y-4">
      <h1 className="text-2xl font-semibold">Members and invitations</h1>
      <p className="text-sm text-ink-soft">
        Owners and estimators take a paid seat; sponsors and billing members are free.
      </p>
      <QueryPrefill
        entries={[
          { key: ['members'], data: { members } },
          { key: ['invitations'], data: { invitations } },
        ]}
      >
        <MembersPanel selfUserId={actor.userId} />
      </QueryPrefill>
    </div>
  );
}
