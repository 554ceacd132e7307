import { Brand } from '@/components/ui/brand';

export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return (
    <main className="mx-auto flex min-h-screen max-w-md flex-col justify-center px-6 py-12">
      <Brand />
      <div className="mt-6 rounded border border-rule bg-paper-raised p-6 shadow-sm">{children}</div>
    </main>
  );
}
