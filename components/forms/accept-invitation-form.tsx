'use client';

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { signIn, signOut } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { Field, TextInput } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { ApiError, callApi } from './api';

type Values = { name: string; password: string };

const acceptUrl = (token: string) => `/api/invitations/accept/${encodeURIComponent(token)}`;

/**
 * Signed out: makes a new account for the invited address. The server answers the same when
 * the address already has an account, so only a successful sign-in tells us the account is new.
 */
export function AcceptInvitationForm({ token, email }: { token: string; email: string }) {
  const router = useRouter();
  const [failure, setFailure] = useState<string | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError } = useForm<Values>();

  async function onSubmit(values: Values) {
    setFailure(null);
    setNotice(null);
    let reply: { message: string };
    try {
      reply = await callApi<{ message: string }>(acceptUrl(token), { body: values });
    } catch (e) {
      if (!(e instanceof ApiError)) throw e;
      for (const i of e.failure.issues) setError(i.path as keyof Values, { message: i.message });
      setFailure(e.failure.message);
      return;
    }
    const result = await signIn('credentials', { email, password: values.password, redirect: false });
    if (!result || result.error) {
      setNotice(reply.message);
      return;
    }
    // Signed in: confirm as this account (a no-op when the account was just made with the invitation).
    try {
      await callApi(acceptUrl(token), { body: {} });
    } catch (e) {
      if (!(e instanceof ApiError)) throw e;
      setFailure(e.failure.message);
      return;
    }
    router.push('/projects');
    router.refresh();
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} className="space-y-4" noValidate>
      {failure ? <Notice tone="invalid">{failure}</Notice> : null}
      {notice ? <Notice>{notice}</Notice> : null}
      <Field id="name" label="Your name" error={formState.errors.name?.message}>
        <TextInput id="name" autoComplete="name" invalid={!!formState.errors.name} {...register('name')} />
      </Field>
      <Field
        id="password"
        label="Choose a password"
        error={formState.errors.password?.message}
        hint="At least 10 characters."
      >
        <TextInput
          id="password"
          type="password"
          autoComplete="new-password"
          invalid={!!formState.errors.password}
          {...register('password')}
        />
      </Field>
      <Button type="submit" className="w-full" disabled={formState.isSubmitting}>
        Create account and join
      </Button>
    </form>
  );
}

/** Signed in: the invited account joins with one click; another account is told to sign out first. */
export function AcceptSignedInForm({
  token,
  invitedEmail,
  signedInEmail,
}: {
  token: string;
  invitedEmail: string;
  signedInEmail: string;
}) {
  const router = useRouter();
  const [failure, setFailure] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  if (invitedEmail !== signedInEmail.toLowerCase()) {
    return (
      <div className="space-y-4">
        <Notice tone="invalid">
          You are signed in as {signedInEmail}. This invitation is for another e-mail address: sign out, then
          open the link again.
        </Notice>
        <Button
          type="button"
          className="w-full"
          onClick={() => signOut({ callbackUrl: `/invitations/${encodeURIComponent(token)}` })}
        >
          Sign out
        </Button>
      </div>
    );
  }

  async function accept() {
    setFailure(null);
    setBusy(true);
    try {
      await callApi(acceptUrl(token), { body: {} });
    } catch (e) {
      setBusy(false);
      if (!(e instanceof ApiError)) throw e;
      setFailure(e.failure.message);
      return;
    }
    router.push('/projects');
    router.refresh();
  }

  return (
    <div className="space-y-4">
      {failure ? <Notice tone="invalid">{failure}</Notice> : null}
      <p className="text-sm">You are signed in as {signedInEmail}.</p>
      <Button type="button" className="w-full" disabled={busy} onClick={accept}>
        Accept and join
      </Button>
    </div>
  );
}
