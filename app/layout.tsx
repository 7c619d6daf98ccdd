import type { Metadata } from 'next';
import { connection } from 'next/server';
import './globals.css';
import { appFont } from './fonts';
import { Providers } from '@/components/providers';

export const metadata: Metadata = {
  title: { default: 'Tidewarden', template: '%s · Tidewarden' },
  description: 'Sacrificial-anode cathodic protection for ship hulls and harbour structures: design, register, surveys and dry-dock anode lists.',
};

export default async function RootLayout({ children }: { children: React.ReactNode }) {
  // Every page is rendered per request so that its scripts carry that response's CSP nonce (proxy.ts);
  // a page prerendered at build time would have scripts without one, and the browser would block them.
  await connection();
  return (
    <html lang="en-GB" className={appFont.variable}>
      <body className="min-h-screen bg-paper font-sans text-base text-ink antialiased">
        {/* The first stop of the Tab key on every page; every page's <main id="content" tabIndex={-1}> is its target. */}
        <a
          href="#content"
          className="no-print sr-only z-50 rounded-[3px] bg-tide-900 px-4 py-3 text-sm font-semibold text-white focus:not-sr-only focus:fixed focus:left-2 focus:top-2"
        >
          Skip to content
        </a>
        <Providers>{children}</Providers>
      </body>
    </html>
  );
}
