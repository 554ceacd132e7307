import Link from 'next/link';
import { resetLinkState, type ResetLinkState } from '@/lib/services/password-reset';
import { ResetPasswordForm } from '@/components/forms/reset-password-form';

// The token is in the address: never hand it to another site in a Referer header.
export const metadata = { title: 'Set a new password', referrer: 'no-referrer' as const };
export const dynamic = 'force-dynamic';

const UNUSABLE: Record<Exclude<ResetLinkState, 'valid'>, { title: string; text: string }> = {
  expired: { title: 'This link has expired', text: 'Reset links work for one hour. Ask for a new one.' },
  used: {
    title: 'This link was already used',
    text: 'A reset link works once, and a newer request replaces older links. Ask for a new one if you still need it.',
  },
  unknown: {
    title: 'This link does not work',
    text: 'Check that the whole address was copied, or ask for a new link.',
  },
};

export default async function ResetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const state = await resetLinkState(token);
  if (state !== 'valid') {
    const { title, text } = UNUSABLE[state];
    return (
      <>
        <h1 className="text-xl font-semibold">{title}</h1>
        <p className="mt-2 text-sm text-ink-soft">{text}</p>
        <Link href="/forgot-password" className="mt-4 inline-block text-cost underline">
          Ask for a new link
        </Link>
      </>
    );
  }
  return (
    <>
      <h1 className="text-xl font-semibold">Set a new password</h1>
      <p className="mb-4 mt-1 text-sm text-ink-soft">Choose a password of at least 10 characters.</p>
      <ResetPasswordForm token={token} />
    </>
  );
}
