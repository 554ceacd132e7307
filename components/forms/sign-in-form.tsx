'use client';

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { signIn } from 'next-auth/react';
import { useRouter, useSearchParams } from 'next/navigation';
import { signInSchema } from '@/lib/validation/auth';
import { safeCallbackPath } from '@/lib/auth/callback-url';
import { Field, TextInput } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';

type Values = { email: string; password: string };

export function SignInForm() {
  const router = useRouter();
  const params = useSearchParams();
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<Values>({ resolver: zodResolver(signInSchema) });

  async function onSubmit(values: Values) {
    setFailure(null);
    const result = await signIn('credentials', { ...values, redirect: false });
    if (!result || result.error) {
      setFailure(
        result?.error && result.error !== 'CredentialsSignin'
          ? result.error
          : 'Sign-in failed. Check your e-mail and password.',
      );
      return;
    }
    router.push(safeCallbackPath(params.get('callbackUrl')));
    router.refresh();
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} className="space-y-4" noValidate>
      {failure ? <Notice tone="invalid">{failure}</Notice> : null}
      <Field id="email" label="E-mail" error={formState.errors.email?.message}>
        <TextInput
          id="email"
          type="email"
          autoComplete="email"
          invalid={!!formState.errors.email}
          {...register('email')}
        />
      </Field>
      <Field id="password" label="Password" error={formState.errors.password?.message}>
        <TextInput
          id="password"
          type="password"
          autoComplete="current-password"
          invalid={!!formState.errors.password}
          {...register('password')}
        />
      </Field>
      <Button type="submit" className="w-full" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? 'Signing in…' : 'Sign in'}
      </Button>
    </form>
  );
}
