'use client';

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { signIn } from 'next-auth/react';
import { useRouter, useSearchParams } from 'next/navigation';
import { signInSchema } from '@/lib/validation/auth';
import { safeCallbackPath } from '@/lib/auth/callback-url';
import { AccountForm, type SubmitWords, type TextFieldSpec } from './form-parts';

type Values = { email: string; password: string };

const FIELDS: TextFieldSpec<Values>[] = [
  { name: 'email', label: 'E-mail', type: 'email', autoComplete: 'email' },
  { name: 'password', label: 'Password', type: 'password', autoComplete: 'current-password' },
];
const SUBMIT: SubmitWords = { idle: 'Sign in', busy: 'Signing in…' };

export function SignInForm() {
  const router = useRouter();
  const params = useSearchParams();
  const [failure, setFailure] = useState<string | null>(null);
  const form = useForm<Values>({ resolver: zodResolver(signInSchema) });

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

  return <AccountForm form={form} fields={FIELDS} onSubmit={onSubmit} failure={failure} submit={SUBMIT} />;
}
