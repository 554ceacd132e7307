import { Suspense } from 'react';
import Link from 'next/link';
import { SignInForm } from '@/components/forms/sign-in-form';

export const metadata = { title: 'Sign in' };

export default function SignInPage() {
  return (
    <>
      <h1 className="text-xl font-semibold">Sign in</h1>
      <p className="mb-4 mt-1 text-sm text-ink-soft">Use the e-mail and password of your Outturn account.</p>
      <Suspense>
        <SignInForm />
      </Suspense>
      <p className="mt-3 text-sm">
        <Link href="/forgot-password" className="text-cost underline">
          Forgot your password?
        </Link>
      </p>
      <p className="mt-4 text-sm text-ink-soft">
        New here?{' '}
        <Link href="/sign-up" className="text-cost underline">
          Create an organisation
        </Link>
      </p>
    </>
  );
}
