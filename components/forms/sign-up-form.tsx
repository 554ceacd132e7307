'use client';

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { signUpSchema, type SignUpInput } from '@/lib/validation/auth';
import { Field, TextInput } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { ApiError, callApi } from './api';

export function SignUpForm() {
  const router = useRouter();
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError } = useForm<SignUpInput>({
    resolver: zodResolver(signUpSchema),
  });
  const errors = formState.errors;

  async function onSubmit(values: SignUpInput) {
    setFailure(null);
    try {
      await callApi('/api/sign-up', { body: values });
    } catch (e) {
      if (e instanceof ApiError) {
        for (const issue of e.failure.issues) {
          if (issue.path in values) setError(issue.path as keyof SignUpInput, { message: issue.message });
        }
        setFailure(e.failure.message);
        return;
      }
      throw e;
    }
    const result = await signIn('credentials', {
      email: values.email,
      password: values.password,
      redirect: false,
    });
    if (!result || result.error) {
      // The address already had an account: its owner has been mailed, and we say no more here.
      setFailure(
        'We could not sign you in. Check your mail: if this address already has an Outturn account, we sent it a way back in.',
      );
      return;
    }
    router.push('/projects');
    router.refresh();
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} className="space-y-4" noValidate>
      {failure ? <Notice tone="invalid">{failure}</Notice> : null}
      <Field id="name" label="Your name" error={errors.name?.message}>
        <TextInput id="name" autoComplete="name" invalid={!!errors.name} {...register('name')} />
      </Field>
      <Field id="organizationName" label="Organisation" error={errors.organizationName?.message}>
        <TextInput
          id="organizationName"
          autoComplete="organization"
          invalid={!!errors.organizationName}
          {...register('organizationName')}
        />
      </Field>
      <Field id="email" label="Work e-mail" error={errors.email?.message}>
        <TextInput
          id="email"
          type="email"
          autoComplete="email"
          invalid={!!errors.email}
          {...register('email')}
        />
      </Field>
      <Field id="password" label="Password" error={errors.password?.message} hint="At least 10 characters.">
        <TextInput
          id="password"
          type="password"
          autoComplete="new-password"
          invalid={!!errors.password}
          {...register('password')}
        />
      </Field>
      <Button type="submit" className="w-full" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? 'Creating…' : 'Create organisation'}
      </Button>
    </form>
  );
}
