'use client';

import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { InvoiceRefresh } from '@/lib/view-types/billing';
import { callApi } from '@/components/forms/api';
import { FailureNotice } from '@/components/forms/failure-notice';
import { Button } from '@/components/ui/button';

/** Reads the invoice list again from the payment service, for when a webhook went missing. */
export function RefreshInvoices() {
  const queryClient = useQueryClient();
  const refresh = useMutation({
    mutationFn: () => callApi<InvoiceRefresh>('/api/billing/invoices', { method: 'POST', body: {} }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['billing'] }),
  });
  return (
    <div className="mt-2 flex items-center gap-3 text-sm">
      <Button variant="secondary" onClick={() => refresh.mutate()} disabled={refresh.isPending}>
        {refresh.isPending ? 'Reading…' : 'Read the invoices again'}
      </Button>
      <FailureNotice error={refresh.error} />
    </div>
  );
}
