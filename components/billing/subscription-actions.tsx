'use client';

import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BillingOverview } from '@/lib/view-types/billing';
import { callApi } from '@/components/forms/api';
import { FailureNotice } from '@/components/forms/failure-notice';
import { Button } from '@/components/ui/button';
import { day } from './format';

/** Cancel at the end of the paid period, or undo that before it ends. */
export function SubscriptionActions({ billing }: { billing: BillingOverview }) {
  const queryClient = useQueryClient();
  const change = useMutation({
    mutationFn: (action: 'cancel' | 'resume') =>
      callApi(`/api/billing/${action}`, { method: 'POST', body: {} }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['billing'] }),
  });
  const end = day(billing.currentPeriodEnd);
  return (
    <div className="space-y-2 text-sm">
      <FailureNotice error={change.error} />
      {billing.cancelAtPeriodEnd ? (
        <>
          <p>
            The subscription ends on <strong>{end}</strong>. Until then everyone keeps working; afterwards the
            organisation becomes read-only (data kept, exports allowed).
          </p>
          <Button onClick={() => change.mutate('resume')} disabled={change.isPending}>
            {change.isPending ? 'Resuming…' : 'Resume the subscription'}
          </Button>
        </>
      ) : (
        <>
          <p className="text-ink-soft">
            Cancelling stops the renewal: the seats stay until {end}, then the organisation becomes read-only.
          </p>
          <Button
            variant="danger"
            disabled={change.isPending}
            onClick={() =>
              window.confirm(`Cancel the subscription at the end of the period (${end})?`) &&
              change.mutate('cancel')
            }
          >
            {change.isPending ? 'Cancelling…' : 'Cancel at period end'}
          </Button>
        </>
      )}
    </div>
  );
}
