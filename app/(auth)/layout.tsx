import type { ReactNode } from 'react';
import { Logo } from '@/components/layout/logo';
import { SiteFrame } from '@/components/layout/site-frame';

export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <SiteFrame>
      <div className="mx-auto grid max-w-4xl gap-8 py-4 md:grid-cols-2 md:items-center">
        <aside className="hidden md:block">
          <Logo className="h-14 w-14" />
          <p className="mt-4 text-2xl font-bold leading-snug">Your shop notes, clips and measurements, kept together.</p>
          <ul className="mt-4 space-y-2 text-graphite-2">
            <li>▸ One account: build your own projects, follow others&apos;.</li>
            <li>▸ Invite a mentor to look over risky set-ups.</li>
            <li>▸ Every critical size judged against its fit.</li>
          </ul>
        </aside>
        <div className="rounded-xl border border-rule bg-card p-6 shadow-sm sm:p-8">{children}</div>
      </div>
    </SiteFrame>
  );
}
