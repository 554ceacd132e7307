'use client';

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useQueryClient } from '@tanstack/react-query';
import { seatsSchema, type SeatsInput } from '@/lib/billing/schemas';
import type { BillingOverview, SeatChangePreview } from '@/lib/view-types/billing';
import { ApiError, callApi } from '@/components/forms/api';
import { Field, TextInput } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { day, money } from './format';

type Values = SeatsInput;

/**
 * Without a paid subscription the seats are bought through the payment page; with one, the
 * change is previewed (the payment service prorates it) and charged only once confirmed.
 */
export function SeatForm({ billing }: { billing: BillingOverview }) {
  const queryClient = useQueryClient();
  const [problem, setProblem] = useState<string | null>(null);
  const [preview, setPreview] = useState<SeatChangePreview | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const form = useForm<Values>({
    resolver: zodResolver(seatsSchema),
    defaultValues: { seats: Math.max(billing.seats ?? billing.used, billing.used, 1) },
  });

  function fail(e: unknown) {
    if (e instanceof ApiError)
      for (const i of e.failure.issues)
        if (i.path === 'seats') form.setError('seats', { message: i.message });
    setProblem(e instanceof ApiError ? e.failure.message : 'The server could not be reached. Try again.');
  }

  async function onSubmit(values: Values) {
    setProblem(null);
    setDone(null);
    try {
      if (!billing.subscribed) {
        const { checkout } = await callApi<{ checkout: { url: string } }>('/api/billing/checkout', {
          body: values,
        });
        window.location.assign(checkout.url);
        return;
      }
      const { preview } = await callApi<{ preview: SeatChangePreview }>('/api/billing/seats/preview', {
        body: values,
      });
      setPreview(preview);
    } catch (e) {
      fail(e);
    }
  }

  async function confirm() {
    if (!preview) return;
    setBusy(true);
    setProblem(null);
    try {
      await callApi('/api/billing/seats', {
        body: { seats: preview.seats, prorationDate: preview.prorationDate },
      });
      setDone(`The organisation now has ${preview.seats} paid seats.`);
      setPreview(null);
      await queryClient.invalidateQueries({ queryKey: ['billing'] });
    } catch (e) {
      fail(e);
    } finally {
      setBusy(false);
    }
  }

  const seatsField = form.register('seats', { onChange: () => setPreview(null) });
  const charge = preview?.amountDue ?? 0;
  return (
    <div className="space-y-3">
      {problem ? <Notice tone="invalid">{problem}</Notice> : null}
      {done ? <Notice tone="success">{done}</Notice> : null}
      <form onSubmit={form.handleSubmit(onSubmit)} className="flex items-end gap-3" noValidate>
        <div className="w-40">
          <Field
            id="seat-count"
            label="Paid seats"
            error={form.formState.errors.seats?.message}
            hint={`${billing.used} in use`}
          >
            <TextInput
              id="seat-count"
              type="number"
              min={1}
              step={1}
              inputMode="numeric"
              className="num"
              invalid={!!form.formState.errors.seats}
              {...seatsField}
            />
          </Field>
        </div>
        <Button type="submit" disabled={form.formState.isSubmitting || busy}>
          {billing.subscribed
            ? form.formState.isSubmitting
              ? 'Working out the charge…'
              : 'Preview the change'
            : form.formState.isSubmitting
              ? 'Opening the payment page…'
              : 'Continue to payment'}
        </Button>
        <p className="pb-1.5 text-xs text-ink-faint">
          {money(billing.unitAmount, billing.currency)} per seat per month
        </p>
      </form>

      {preview ? (
        <div className="rounded border border-rule bg-paper-sunk p-3" data-testid="seat-preview">
          <p className="text-sm">
            From {preview.currentSeats} to {preview.seats} seats. The payment service prorates the change to
            the end of this period ({day(preview.periodEnd)}):
          </p>
          <ul className="my-2 space-y-0.5 text-sm">
            {preview.lines.map((l, i) => (
              <li key={i} className="flex max-w-lg justify-between gap-6">
                <span className="text-ink-soft">{l.description}</span>
                <span className="num">{money(l.amount, preview.currency)}</span>
              </li>
            ))}
            <li className="flex max-w-lg justify-between gap-6 border-t border-rule pt-1 font-semibold">
              <span>{charge >= 0 ? 'Charged now' : 'Credited to the next invoice'}</span>
              <span className="num" data-testid="proration-amount">
                {money(Math.abs(charge), preview.currency)}
              </span>
            </li>
          </ul>
          <div className="flex gap-2">
            <Button onClick={confirm} disabled={busy}>
              {busy ? 'Changing…' : `Confirm ${preview.seats} seats`}
            </Button>
            <Button variant="secondary" onClick={() => setPreview(null)} disabled={busy}>
              Keep {preview.currentSeats}
            </Button>
          </div>
        </div>
      ) : null}
    </div>
  );
}
