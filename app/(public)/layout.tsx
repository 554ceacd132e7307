import Link from 'next/link';
import { Brand } from '@/components/ui/brand';
import { buttonClass } from '@/components/ui/button';

export default function PublicLayout({ children }: { children: React.ReactNode }) {
  return (
    <div className="min-h-screen">
      <header className="border-b border-rule bg-paper-raised">
        <div className="mx-auto flex max-w-6xl items-center justify-between px-6 py-3">
          <Brand />
          <nav className="flex items-center gap-2">
            <Link href="/sign-in" className={buttonClass('ghost')}>
              Sign in
            </Link>
            <Link href="/sign-up" className={buttonClass('primary')}>
              Create an organisation
            </Link>
          </nav>
        </div>
      </header>
      <main>{children}</main>
    </div>
  );
}
