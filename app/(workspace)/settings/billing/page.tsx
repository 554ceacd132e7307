import { requirePageActor } from '@/lib/auth/guard';
import { can } from '@/lib/auth/roles';
import { BillingPanel } from '@/components/billing/billing-panel';

export const metadata = { title: 'Billing and seats' };

export default async function BillingPage({
  searchParams,
}: {
  searchParams: Promise<{ checkout?: string | string[] }>;
}) {
  const actor = await requirePageActor('billing:read', '/settings/billing');
  const { checkout } = await searchParams;
  return (
    <div className="max-w-5xl space-y-4">
      <h1 className="text-2xl font-semibold">Billing and seats</h1>
      <p className="text-sm text-ink-soft">
        The organisation pays per paid seat each month. Payments go through the payment service; Outturn keeps
        no card details.
      </p>
      <BillingPanel
        canManage={can(actor.role, 'billing:manage')}
        checkout={typeof checkout === 'string' ? checkout : undefined}
      />
    </div>
  );
}
