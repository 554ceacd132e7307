import Link from 'next/link';
import { describeInvitation } from '@/lib/services/members';
import { currentUser } from '@/lib/auth/guard';
import { ROLE_LABELS } from '@/lib/auth/roles';
import { AcceptInvitationForm, AcceptSignedInForm } from '@/components/forms/accept-invitation-form';

export const metadata = { title: 'Invitation' };

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const invitation = await describeInvitation(token);
  if (!invitation) {
    return (
      <>
        <h1 className="text-xl font-semibold">This invitation cannot be used</h1>
        <p className="mt-2 text-sm text-ink-soft">
          It has expired, was revoked, or was already accepted. Ask an owner for a new one.
        </p>
        <Link href="/sign-in" className="mt-4 inline-block text-cost underline">
          Sign in
        </Link>
      </>
    );
  }
  const user = await currentUser();
  const back = `/invitations/${encodeURIComponent(token)}`;
  return (
    <>
      <h1 className="text-xl font-semibold">Join {invitation.organizationName}</h1>
      <p className="mb-4 mt-1 text-sm text-ink-soft">
        {invitation.email} is invited as <strong>{ROLE_LABELS[invitation.role]}</strong>.
      </p>
      {user ? (
        <AcceptSignedInForm token={token} invitedEmail={invitation.email} signedInEmail={user.email} />
      ) : (
        <>
          <AcceptInvitationForm token={token} email={invitation.email} />
          <p className="mt-4 text-sm text-ink-soft">
            Already have an Outturn account with this address?{' '}
            <Link href={`/sign-in?callbackUrl=${encodeURIComponent(back)}`} className="text-cost underline">
              Sign in to accept
            </Link>
          </p>
        </>
      )}
    </>
  );
}
