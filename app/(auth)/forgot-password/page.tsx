import Link from 'next/link';
import { ForgotPasswordForm } from '@/components/forms/forgot-password-form';

export const metadata = { title: 'Forgot your password?' };

export default function ForgotPasswordPage() {
  return (
    <>
      <h1 className="text-xl font-semibold">Forgot your password?</h1>
      <p className="mb-4 mt-1 text-sm text-ink-soft">
        Enter the e-mail of your Outturn account. We will send a link to choose a new password; it works once,
        for one hour.
      </p>
      <ForgotPasswordForm />
      <p className="mt-4 text-sm text-ink-soft">
        Remembered it?{' '}
        <Link href="/sign-in" className="text-cost underline">
          Sign in
        </Link>
      </p>
    </>
  );
}
