'use client';

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { emailSchema } from '@/lib/validation/auth';
import { Field, TextInput } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { ApiError, callApi } from './api';

const schema = z.object({ email: emailSchema });
type Values = z.input<typeof schema>;

export function ForgotPasswordForm() {
  const [sent, setSent] = useState<string | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError } = useForm<Values>({ resolver: zodResolver(schema) });

  async function onSubmit(values: Values) {
    setFailure(null);
    try {
      const reply = await callApi<{ message: string }>('/api/password-reset', { body: values });
      setSent(reply.message);
    } catch (e) {
      if (!(e instanceof ApiError)) {
        setFailure('The server could not be reached. Try again.');
        return;
      }
      for (const i of e.failure.issues) setError(i.path as keyof Values, { message: i.message });
      setFailure(e.failure.message);
    }
  }

  if (sent) {
    return (
      <div className="space-y-3">
        <Notice tone="success" title="Check your inbox">
          {sent}
        </Notice>
        <p className="text-sm text-ink-soft">
          Nothing after a few minutes? Look in the spam folder, or ask again with the address your account
          uses.
        </p>
      </div>
    );
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} className="space-y-4" noValidate>
      {failure ? <Notice tone="invalid">{failure}</Notice> : null}
      <Field id="email" label="E-mail" error={formState.errors.email?.message}>
        <TextInput
          id="email"
          type="email"
          autoComplete="email"
          autoFocus
          invalid={!!formState.errors.email}
          {...register('email')}
        />
      </Field>
      <Button type="submit" className="w-full" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? 'Sending…' : 'Send me a reset link'}
      </Button>
    </form>
  );
}
