'use client';

import { useState } from 'react';
import Link from 'next/link';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { passwordSchema } from '@/lib/validation/auth';
import { Field, TextInput } from '@/components/ui/field';
import { Button, buttonClass } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { ApiError, callApi } from './api';

// The same password rule as sign-up, plus a second entry to catch a typing slip.
const schema = z
  .object({ password: passwordSchema, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'The two passwords differ.' });
type Values = z.input<typeof schema>;

export function ResetPasswordForm({ token }: { token: string }) {
  const [done, setDone] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError } = useForm<Values>({ resolver: zodResolver(schema) });

  async function onSubmit(values: Values) {
    setFailure(null);
    try {
      await callApi(`/api/password-reset/${encodeURIComponent(token)}`, {
        body: { password: values.password },
      });
      setDone(true);
    } catch (e) {
      if (!(e instanceof ApiError)) {
        setFailure('The server could not be reached. Your password is unchanged; try again.');
        return;
      }
      for (const i of e.failure.issues) setError(i.path as keyof Values, { message: i.message });
      setFailure(e.failure.message);
    }
  }

  if (done) {
    return (
      <div className="space-y-4">
        <Notice tone="success" title="Password changed">
          Sign in with your new password. The link you used no longer works.
        </Notice>
        <Link href="/sign-in" className={buttonClass('primary', 'w-full')}>
          Sign in
        </Link>
      </div>
    );
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} className="space-y-4" noValidate>
      {failure ? <Notice tone="invalid">{failure}</Notice> : null}
      <Field
        id="password"
        label="New password"
        error={formState.errors.password?.message}
        hint="At least 10 characters."
      >
        <TextInput
          id="password"
          type="password"
          autoComplete="new-password"
          autoFocus
          invalid={!!formState.errors.password}
          {...register('password')}
        />
      </Field>
      <Field id="confirm" label="New password again" error={formState.errors.confirm?.message}>
        <TextInput
          id="confirm"
          type="password"
          autoComplete="new-password"
          invalid={!!formState.errors.confirm}
          {...register('confirm')}
        />
      </Field>
      <Button type="submit" className="w-full" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? 'Saving…' : 'Set the new password'}
      </Button>
    </form>
  );
}
