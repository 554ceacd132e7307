'use client';

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { signUpSchema, type SignUpInput } from '@/lib/validation/auth';
import { ApiError, callApi } from './api';
import { AccountForm, type SubmitWords, showRefusal, type TextFieldSpec } from './form-parts';

const FIELDS: TextFieldSpec<SignUpInput>[] = [
  { name: 'name', label: 'Your name', autoComplete: 'name' },
  { name: 'organizationName', label: 'Organisation', autoComplete: 'organization' },
  { name: 'email', label: 'Work e-mail', type: 'email', autoComplete: 'email' },
  {
    name: 'password',
    label: 'Password',
    type: 'password',
    autoComplete: 'new-password',
    hint: 'At least 10 characters.',
  },
];
const SUBMIT: SubmitWords = { idle: 'Create organisation', busy: 'Creating…' };

export function SignUpForm() {
  const router = useRouter();
  const [failure, setFailure] = useState<string | null>(null);
  const form = useForm<SignUpInput>({
    resolver: zodResolver(signUpSchema),
  });

  async function onSubmit(values: SignUpInput) {
    setFailure(null);
    try {
      await callApi('/api/sign-up', { body: values });
    } catch (e) {
      if (e instanceof ApiError) {
        showRefusal(e, form.setError, setFailure, values);
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

  return <AccountForm form={form} fields={FIELDS} onSubmit={onSubmit} failure={failure} submit={SUBMIT} />;
}
