import Link from 'next/link';
import { Brand } from '@/components/ui/brand';

export default function NotFound() {
  return (
    <main className="mx-auto max-w-lg px-6 py-20">
      <Brand />
      <h1 className="mt-8 text-2xl font-semibold">Not found</h1>
      <p className="mt-2 text-ink-soft">This page does not exist, or it belongs to another organisation.</p>
      <Link href="/projects" className="mt-6 inline-block text-cost underline">
        Go to your projects
      </Link>
    </main>
  );
}
