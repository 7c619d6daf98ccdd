import type { Metadata } from 'next';
import './globals.css';
import { appFont } from './fonts';
import { Providers } from '@/components/providers';

export const metadata: Metadata = {
  title: { default: 'Tidewarden', template: '%s · Tidewarden' },
  description: 'Sacrificial-anode cathodic protection for ship hulls and harbour structures: design, register, surveys and dry-dock anode lists.',
};

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en-GB" className={appFont.variable}>
      <body className="min-h-screen bg-paper font-sans text-base text-ink antialiased">
        <Providers>{children}</Providers>
      </body>
    </html>
  );
}
