import type { Metadata } from 'next';
import localFont from 'next/font/local';
import './globals.css';

// Shipped with the app from the npm font package; nothing is fetched at build or run time.
const inter = localFont({
  src: '../node_modules/@fontsource-variable/inter/files/inter-latin-wght-normal.woff2',
  variable: '--font-inter',
  display: 'swap',
});

// Every page is rendered per request, so that it carries the nonce of its content security policy.
export const dynamic = 'force-dynamic';

export const metadata: Metadata = {
  title: { default: 'Outturn', template: '%s · Outturn' },
  description: 'Probabilistic cost and schedule risk analysis for capital projects.',
};

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en" className={inter.variable}>
      <body className="min-h-screen">{children}</body>
    </html>
  );
}
