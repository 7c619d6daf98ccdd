import type { Metadata } from 'next';
import { connection } from 'next/server';
import './globals.css';
import { appFont } from './fonts';
import { Providers } from '@/components/providers';

export const metadata: Metadata = {
  // Absolute addresses for the social image (APP_URL is the public address; checked at start in lib/server/env.ts).
  metadataBase: new URL(process.env.APP_URL || 'http://127.0.0.1:3000'),
  title: { default: 'Tidewarden', template: '%s · Tidewarden' },
  description: 'Sacrificial-anode cathodic protection for ship hulls and harbour structures: design, register, surveys and dry-dock anode lists.',
  // Our own mark (scripts/icons/make-icons.mjs draws these into public/ from scripts/icons/mark.svg).
  icons: {
    icon: [
      { url: '/favicon.ico', sizes: '32x32' },
      { url: '/icon.svg', type: 'image/svg+xml' },
    ],
    apple: [{ url: '/apple-touch-icon.png', sizes: '180x180' }],
  },
  manifest: '/manifest.webmanifest',
  // The social card (openGraph) is on the public pages only (PUBLIC_METADATA): a link to a signed-in page opens the
  // sign-in page for whoever follows it, and resolving the card cost every signed-in page's render (measured).
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
