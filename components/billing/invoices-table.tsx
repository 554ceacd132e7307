'use client';

import { Fragment, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import type { InvoiceDetail, InvoiceView } from '@/lib/view-types/billing';
import { ApiError, callApi } from '@/components/forms/api';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { INVOICE_REASONS, day, money } from './format';
import { TableHead, type HeadCell } from '@/components/ui/table';

function InvoiceLines({ id }: { id: number }) {
  const detail = useQuery({
    queryKey: ['invoice', id],
    queryFn: () => callApi<{ invoice: InvoiceDetail }>(`/api/billing/invoices/${id}`),
  });
  if (detail.isPending) return <p className="text-xs text-ink-faint">Loading the lines…</p>;
  if (detail.isError)
    return (
      <Notice tone="invalid">
        {detail.error instanceof ApiError ? detail.error.failure.message : 'The lines could not be loaded.'}
      </Notice>
    );
  const { lines, currency } = detail.data.invoice;
  if (!lines) return <p className="text-xs text-ink-faint">The payment service did not return the lines.</p>;
  return (
    <ul className="space-y-0.5 text-xs text-ink-soft">
      {lines.map((l, i) => (
        <li key={i} className="flex justify-between gap-6">
          <span>{l.description}</span>
          <span className="num">{money(l.amount, currency)}</span>
        </li>
      ))}
    </ul>
  );
}

const HEAD: HeadCell[] = [
  'Number',
  'Issued',
  'For',
  'Period',
  'Status',
  { title: 'Amount', align: 'right' },
  '',
];

export function InvoicesTable({ invoices }: { invoices: InvoiceView[] }) {
  const [open, setOpen] = useState<number | null>(null);
  if (!invoices.length)
    return (
      <p className="text-sm text-ink-soft">No invoices yet: the first one comes with the first payment.</p>
    );
  return (
    <table className="w-full text-sm" aria-label="Invoices">
      <TableHead look="plain" cells={HEAD} />
      <tbody>
        {invoices.map((i) => (
          <Fragment key={i.id}>
            <tr className="border-t border-rule" data-testid={`invoice-${i.number ?? i.id}`}>
              <td className="py-1.5 font-mono text-xs">{i.number ?? '—'}</td>
              <td className="py-1.5">{day(i.issuedAt)}</td>
              <td className="py-1.5">{(i.reason && INVOICE_REASONS[i.reason]) ?? i.reason ?? '—'}</td>
              <td className="py-1.5 text-ink-soft">
                {day(i.periodStart)} – {day(i.periodEnd)}
              </td>
              <td className="py-1.5">
                {i.status === 'paid' ? (
                  <span>Paid {day(i.paidAt)}</span>
                ) : (
                  <span className="text-caution-dark">{i.status === 'open' ? 'Unpaid' : i.status}</span>
                )}
              </td>
              <td className="num py-1.5">{money(i.total, i.currency)}</td>
              <td className="py-1.5 text-right">
                <Button
                  variant="ghost"
                  aria-expanded={open === i.id}
                  onClick={() => setOpen(open === i.id ? null : i.id)}
                >
                  {open === i.id ? 'Hide lines' : 'Lines'}
                </Button>
              </td>
            </tr>
            {open === i.id ? (
              <tr>
                <td colSpan={7} className="bg-paper-sunk px-3 py-2">
                  <InvoiceLines id={i.id} />
                </td>
              </tr>
            ) : null}
          </Fragment>
        ))}
      </tbody>
    </table>
  );
}
