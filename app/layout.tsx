import type { Metadata, Viewport } from 'next';
import type { ReactNode } from 'react';
import './globals.css';
import { sans, mono } from './fonts';
import { SiteHeader } from '@/components/layout/site-header';

export const metadata: Metadata = {
  title: { default: 'Scribeline', template: '%s · Scribeline' },
  description: 'A build log for home-shop machinists: sessions, clips, notes and every critical dimension checked against ISO 286.',
};

export const viewport: Viewport = { width: 'device-width', initialScale: 1 };

// Reads no session: what everyone sees is cached once; the header's account corner is a dynamic hole.
export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en" className={`${sans.variable} ${mono.variable}`}>
      <body className="antialiased">
        <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-card focus:p-2">
          Skip to content
        </a>
        <SiteHeader />
        <main id="main" className="mx-auto w-full max-w-6xl px-4 py-6 sm:py-8">
          {children}
        </main>
        <footer className="mx-auto max-w-6xl px-4 pb-8 pt-4 text-xs text-graphite-2">
          Scribeline — build logs for home-shop machinists. Machining can hurt you: follow your machine&apos;s manual, local rules and qualified instruction.
        </footer>
      </body>
    </html>
  );
}
