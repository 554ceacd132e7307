'use client';

import { useState } from 'react';
import Link from 'next/link';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { passwordSchema } from '@/lib/validation/auth';
import { buttonClass } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { callApi } from './api';
import { AccountForm, type SubmitWords, sendForm, type TextFieldSpec } from './form-parts';

// The same password rule as sign-up, plus a second entry to catch a typing slip.
const schema = z
  .object({ password: passwordSchema, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'The two passwords differ.' });
type Values = z.input<typeof schema>;

const FIELDS: TextFieldSpec<Values>[] = [
  {
    name: 'password',
    label: 'New password',
    type: 'password',
    autoComplete: 'new-password',
    autoFocus: true,
    hint: 'At least 10 characters.',
  },
  { name: 'confirm', label: 'New password again', type: 'password', autoComplete: 'new-password' },
];
const UNREACHABLE = 'The server could not be reached. Your password is unchanged; try again.';
const SUBMIT: SubmitWords = { idle: 'Set the new password', busy: 'Saving…' };

export function ResetPasswordForm({ token }: { token: string }) {
  const [done, setDone] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);
  const form = useForm<Values>({ resolver: zodResolver(schema) });

  async function send(values: Values) {
    const url = `/api/password-reset/${encodeURIComponent(token)}`;
    await callApi(url, { body: { password: values.password } });
    setDone(true);
  }
  const onSubmit = (values: Values) => sendForm(() => send(values), form.setError, setFailure, UNREACHABLE);

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

  return <AccountForm form={form} fields={FIELDS} onSubmit={onSubmit} failure={failure} submit={SUBMIT} />;
}
