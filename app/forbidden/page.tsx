import Link from 'next/link';
import { Brand } from '@/components/ui/brand';
import { currentActor } from '@/lib/auth/guard';
import { landingPath } from '@/lib/auth/landing';
import { ROLE_LABELS } from '@/lib/auth/roles';

export const metadata = { title: 'Not allowed' };

// The way back leads to the role's own first page, never to a page that sends here again.
export default async function ForbiddenPage() {
  const actor = await currentActor();
  return (
    <main className="mx-auto max-w-lg px-6 py-20">
      <Brand />
      <h1 className="mt-8 text-2xl font-semibold">Your role does not allow this page</h1>
      <p className="mt-2 text-ink-soft">
        {actor
          ? `You are signed in as ${ROLE_LABELS[actor.role].toLowerCase()}. Ask an owner of your organisation if you need access.`
          : 'Sign in to continue.'}
      </p>
      <Link
        href={actor ? landingPath(actor.role) : '/sign-in'}
        className="mt-6 inline-block text-cost underline"
        data-testid="forbidden-back"
      >
        {actor ? 'Back to your start page' : 'Sign in'}
      </Link>
    </main>
  );
}
