import Link from 'next/link';
import { READ_ONLY_MESSAGES, type Access } from '@/lib/billing/access';

/** Shown across the workspace while the organisation cannot edit. */
export function ReadOnlyBanner({ access, canManageBilling }: { access: Access; canManageBilling: boolean }) {
  if (!access.readOnly || !access.reason) return null;
  return (
    <div role="status" data-testid="read-only-banner" className="border-b border-caution/50 bg-caution-light">
      <p className="mx-auto max-w-[1400px] px-5 py-2 text-sm text-caution-dark">
        {READ_ONLY_MESSAGES[access.reason]}{' '}
        {canManageBilling ? (
          <Link href="/settings/billing" className="font-medium underline">
            Go to billing and seats
          </Link>
        ) : (
          'Ask a billing member or an owner to pay it.'
        )}
      </p>
    </div>
  );
}
