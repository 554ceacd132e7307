'use client';

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { signIn, signOut } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { ApiError, callApi } from './api';
import { AccountForm, type SubmitWords, showRefusal, type TextFieldSpec } from './form-parts';

type Values = { name: string; password: string };

const FIELDS: TextFieldSpec<Values>[] = [
  { name: 'name', label: 'Your name', autoComplete: 'name' },
  {
    name: 'password',
    label: 'Choose a password',
    type: 'password',
    autoComplete: 'new-password',
    hint: 'At least 10 characters.',
  },
];
const SUBMIT: SubmitWords = { idle: 'Create account and join' };

const acceptUrl = (token: string) => `/api/invitations/accept/${encodeURIComponent(token)}`;

/**
 * Joins with the signed-in account, then opens the projects; the join answers the server's
 * reason when it is refused.
 */
function useJoin(token: string) {
  const router = useRouter();
  return async (): Promise<string | null> => {
    try {
      await callApi(acceptUrl(token), { body: {} });
    } catch (e) {
      if (!(e instanceof ApiError)) throw e;
      return e.failure.message;
    }
    router.push('/projects');
    router.refresh();
    return null;
  };
}

/**
 * Signed out: makes a new account for the invited address. The server answers the same when
 * the address already has an account, so only a successful sign-in tells us the account is new.
 */
export function AcceptInvitationForm({ token, email }: { token: string; email: string }) {
  const join = useJoin(token);
  const [failure, setFailure] = useState<string | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const form = useForm<Values>();

  async function onSubmit(values: Values) {
    setFailure(null);
    setNotice(null);
    let reply: { message: string };
    try {
      reply = await callApi<{ message: string }>(acceptUrl(token), { body: values });
    } catch (e) {
      if (!(e instanceof ApiError)) throw e;
      showRefusal(e, form.setError, setFailure);
      return;
    }
    const result = await signIn('credentials', { email, password: values.password, redirect: false });
    if (!result || result.error) {
      setNotice(reply.message);
      return;
    }
    // Signed in: confirm as this account (a no-op when the account was just made with the invitation).
    setFailure(await join());
  }

  return (
    <AccountForm form={form} fields={FIELDS} onSubmit={onSubmit} failure={failure} submit={SUBMIT}>
      {notice ? <Notice>{notice}</Notice> : null}
    </AccountForm>
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
  const join = useJoin(token);
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
    const refusal = await join().catch((e: unknown) => {
      setBusy(false);
      throw e;
    });
    if (refusal) {
      setBusy(false);
      setFailure(refusal);
    }
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
