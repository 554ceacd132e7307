'use client';

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { Field, TextInput } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { ApiError, callApi } from './api';

type Values = { name?: string; password: string };

export function AcceptInvitationForm({
  token,
  email,
  hasAccount,
}: {
  token: string;
  email: string;
  hasAccount: boolean;
}) {
  const router = useRouter();
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError } = useForm<Values>();

  async function onSubmit(values: Values) {
    setFailure(null);
    try {
      await callApi(`/api/invitations/accept/${token}`, { body: values });
    } catch (e) {
      if (!(e instanceof ApiError)) throw e;
      for (const i of e.failure.issues) setError(i.path as keyof Values, { message: i.message });
      setFailure(e.failure.message);
      return;
    }
    await signIn('credentials', { email, password: values.password, redirect: false });
    router.push('/projects');
    router.refresh();
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} className="space-y-4" noValidate>
      {failure ? <Notice tone="invalid">{failure}</Notice> : null}
      {hasAccount ? null : (
        <Field id="name" label="Your name" error={formState.errors.name?.message}>
          <TextInput id="name" invalid={!!formState.errors.name} {...register('name')} />
        </Field>
      )}
      <Field
        id="password"
        label={hasAccount ? 'Your current password' : 'Choose a password'}
        error={formState.errors.password?.message}
        hint={hasAccount ? undefined : 'At least 10 characters.'}
      >
        <TextInput
          id="password"
          type="password"
          invalid={!!formState.errors.password}
          {...register('password')}
        />
      </Field>
      <Button type="submit" className="w-full" disabled={formState.isSubmitting}>
        Accept and sign in
      </Button>
    </form>
  );
}
