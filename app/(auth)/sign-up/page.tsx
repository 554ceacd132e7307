import Link from 'next/link';
import { SignUpForm } from '@/components/forms/sign-up-form';

export const metadata = { title: 'Create an organisation' };

export default function SignUpPage() {
  return (
    <>
      <h1 className="text-xl font-semibold">Create an organisation</h1>
      <p className="mb-4 mt-1 text-sm text-ink-soft">
        You become its owner and can invite estimators, sponsors and billing members.
      </p>
      <SignUpForm />
      <p className="mt-4 text-sm text-ink-soft">
        Already have an account?{' '}
        <Link href="/sign-in" className="text-cost underline">
          Sign in
        </Link>
      </p>
    </>
  );
}
