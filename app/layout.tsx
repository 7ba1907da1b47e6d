import type { Metadata, Viewport } from 'next';
import type { ReactNode } from 'react';
import './globals.css';
import { sans, mono } from './fonts';

export const metadata: Metadata = {
  title: { default: 'Scribeline', template: '%s · Scribeline' },
  description: 'A build log for home-shop machinists: sessions, clips, notes and every critical dimension checked against ISO 286.',
};

export const viewport: Viewport = { width: 'device-width', initialScale: 1 };

// Reads no session. The header and the main column come from each group's layout (components/layout/site-frame.tsx):
// the signed-out copies of the log get a header with no dynamic hole, everyone else one with the account corner.
export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en" className={`${sans.variable} ${mono.variable}`}>
      <body className="antialiased">
        <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-card focus:p-2">
          Skip to content
        </a>
        {children}
        <footer className="mx-auto max-w-6xl px-4 pb-8 pt-4 text-xs text-graphite-2">
          Scribeline — build logs for home-shop machinists. Machining can hurt you: follow your machine&apos;s manual, local rules and qualified instruction.
        </footer>
      </body>
    </html>
  );
}
