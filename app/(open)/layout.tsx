import type { ReactNode } from 'react';
import { SiteFrame } from '@/components/layout/site-frame';

// Only signed-out readers reach these pages (proxy.ts): the header is theirs, with no dynamic hole, so each
// page is kept whole in the cache.
export default function OpenLayout({ children }: { children: ReactNode }) {
  return <SiteFrame signedOut>{children}</SiteFrame>;
}
