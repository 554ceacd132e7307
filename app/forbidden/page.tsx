import Link from 'next/link';
import { Brand } from '@/components/ui/brand';

export const metadata = { title: 'Not allowed' };

export default function ForbiddenPage() {
  return (
    <main className="mx-auto max-w-lg px-6 py-20">
      <Brand />
      <h1 className="mt-8 text-2xl font-semibold">Your role does not allow this page</h1>
      <p className="mt-2 text-ink-soft">Ask an owner of your organisation if you need access.</p>
      <Link href="/projects" className="mt-6 inline-block text-cost underline">
        Back to the workspace
      </Link>
    </main>
  );
}
