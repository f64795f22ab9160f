import type { Metadata, Viewport } from 'next';
import type { ReactNode } from 'react';
import { plexGreek, plexMono, plexSans } from './fonts/plex';
import { Providers } from '@/components/providers';
import './globals.css';

export const metadata: Metadata = {
  title: { default: 'Branchwise', template: '%s · Branchwise' },
  description: 'The review board where a materials group gates phonon dispersion spectra before use.',
  icons: { icon: '/icon.svg' },
};

export const viewport: Viewport = { themeColor: '#0e3434' };

export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en" className={`${plexSans.variable} ${plexGreek.variable} ${plexMono.variable}`}>
      <body>
        <a
          href="#main"
          className="sr-only focus:not-sr-only focus:fixed focus:left-3 focus:top-3 focus:z-50 focus:rounded focus:bg-paper-0 focus:px-3 focus:py-2"
        >
          Skip to content
        </a>
        <Providers>{children}</Providers>
      </body>
    </html>
  );
}
