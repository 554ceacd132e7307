'use client';

import { useQuery } from '@tanstack/react-query';
import type { BillingOverview } from '@/lib/view-types/billing';
import { ApiError, callApi } from '@/components/forms/api';
import { Card, Skeleton } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { InvoicesTable } from './invoices-table';
import { RefreshInvoices } from './refresh-invoices';
import { SeatForm } from './seat-form';
import { SubscriptionActions } from './subscription-actions';
import { STATUS_LABELS, day, money } from './format';

function PlanSummary({ billing }: { billing: BillingOverview }) {
  const rows: [string, React.ReactNode][] = [
    ['Plan', billing.plan],
    [
      'Status',
      <span
        key="s"
        data-testid="billing-status"
        className={billing.access.readOnly ? 'text-caution-dark' : ''}
      >
        {STATUS_LABELS[billing.status] ?? billing.status}
        {billing.cancelAtPeriodEnd && billing.status !== 'canceled' ? ' · cancels at period end' : ''}
      </span>,
    ],
    ['Price', `${money(billing.unitAmount, billing.currency)} per paid seat per month`],
  ];
  if (billing.status === 'trialing' && !billing.subscribed)
    rows.push(['Trial ends', day(billing.trialEndsAt)]);
  if (billing.subscribed)
    rows.push([billing.cancelAtPeriodEnd ? 'Ends' : 'Renews', day(billing.currentPeriodEnd)]);
  if (billing.endedAt) rows.push(['Ended', day(billing.endedAt)]);
  return (
    <dl className="grid grid-cols-[9rem_1fr] gap-y-1 text-sm">
      {rows.map(([k, v]) => (
        <div key={k} className="contents">
          <dt className="text-ink-soft">{k}</dt>
          <dd>{v}</dd>
        </div>
      ))}
    </dl>
  );
}

function SeatMeter({ billing }: { billing: BillingOverview }) {
  const seats = billing.seats;
  const full = seats != null && billing.used >= seats;
  return (
    <div className="space-y-2 text-sm">
      <p>
        <span className="num text-2xl font-semibold" data-testid="seats-used">
          {billing.used}
        </span>{' '}
        of{' '}
        <span className="num text-2xl font-semibold" data-testid="seats-bought">
          {seats ?? '—'}
        </span>{' '}
        paid seats in use
      </p>
      {seats ? (
        <div className="h-2 w-full max-w-md rounded bg-paper-sunk" aria-hidden="true">
          <div
            className={`h-2 rounded ${full ? 'bg-caution' : 'bg-cost'}`}
            style={{ width: `${Math.min(100, (billing.used / seats) * 100)}%` }}
          />
        </div>
      ) : null}
      <p className="text-xs text-ink-faint">
        Owners and estimators take a paid seat; sponsors and billing members are free.
        {billing.pendingInvitations
          ? ` ${billing.pendingInvitations} pending invitation${billing.pendingInvitations === 1 ? '' : 's'} for a paid role will need a free seat when accepted.`
          : ''}
      </p>
      {full ? (
        <p className="text-xs text-caution-dark">
          All seats are taken: add seats before inviting another estimator.
        </p>
      ) : null}
    </div>
  );
}

export function BillingPanel({ canManage, checkout }: { canManage: boolean; checkout?: string }) {
  const query = useQuery({
    queryKey: ['billing'],
    queryFn: () => callApi<{ billing: BillingOverview }>('/api/billing'),
  });
  if (query.isPending) return <Skeleton rows={6} />;
  if (query.isError)
    return (
      <Notice tone="invalid">
        {query.error instanceof ApiError ? query.error.failure.message : 'The server could not be reached.'}
      </Notice>
    );
  const billing = query.data.billing;
  return (
    <div className="space-y-4">
      {checkout === 'success' ? (
        <Notice tone="success">Payment received. The seats below are the ones now paid for.</Notice>
      ) : checkout === 'cancelled' ? (
        <Notice tone="info">Checkout cancelled: nothing was charged and the seats are unchanged.</Notice>
      ) : null}
      <div className="grid grid-cols-2 gap-4">
        <Card title="Plan and status">
          <PlanSummary billing={billing} />
        </Card>
        <Card title="Seats">
          <SeatMeter billing={billing} />
        </Card>
      </div>
      {canManage ? (
        <Card title={billing.subscribed ? 'Change the number of seats' : 'Buy seats'}>
          <SeatForm key={`${billing.seats}-${billing.subscribed}`} billing={billing} />
        </Card>
      ) : null}
      {canManage && billing.subscribed ? (
        <Card title="Cancel or resume">
          <SubscriptionActions billing={billing} />
        </Card>
      ) : null}
      <Card title="Invoices">
        <InvoicesTable invoices={billing.invoices} />
        {canManage && billing.subscribed ? <RefreshInvoices /> : null}
      </Card>
    </div>
  );
}
