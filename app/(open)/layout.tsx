import type { ReactNode } from 'react';
import { SiteFrame } from '@/components/layout/site-frame';

// Only signed-out readers reach these pages (next.config.mjs rewrites): the header is theirs, with no dynamic hole.
// (`ensureStatic = 'navigation'` would suit them, but with Next 16.4 an address not built ahead then answers
// 500, NEXT_STATIC_GEN_BAILOUT: DEVELOPERS.md "Reading a page".)

export default function OpenLayout({ children }: { children: ReactNode }) {
  return <SiteFrame signedOut>{children}</SiteFrame>;
}
