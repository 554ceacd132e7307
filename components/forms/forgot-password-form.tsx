'use client';

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { emailSchema } from '@/lib/validation/auth';
import { Notice } from '@/components/ui/notice';
import { callApi } from './api';
import { AccountForm, type SubmitWords, sendForm, type TextFieldSpec } from './form-parts';

const schema = z.object({ email: emailSchema });
type Values = z.input<typeof schema>;

const FIELDS: TextFieldSpec<Values>[] = [
  { name: 'email', label: 'E-mail', type: 'email', autoComplete: 'email', autoFocus: true },
];
const UNREACHABLE = 'The server could not be reached. Try again.';
const SUBMIT: SubmitWords = { idle: 'Send me a reset link', busy: 'Sending…' };

export function ForgotPasswordForm() {
  const [sent, setSent] = useState<string | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const form = useForm<Values>({ resolver: zodResolver(schema) });

  async function send(values: Values) {
    const reply = await callApi<{ message: string }>('/api/password-reset', { body: values });
    setSent(reply.message);
  }
  const onSubmit = (values: Values) => sendForm(() => send(values), form.setError, setFailure, UNREACHABLE);

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

  return <AccountForm form={form} fields={FIELDS} onSubmit={onSubmit} failure={failure} submit={SUBMIT} />;
}
