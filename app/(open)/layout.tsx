import type { ReactNode } from 'react';
import { SiteFrame } from '@/components/layout/site-frame';

// The copies of the published log cached for everyone (next.config.mjs rewrites send signed-out readers and
// signed-in members outside the project's circle here): built as a signed-out reader sees them, with no
// dynamic hole; a member's own corner and controls are filled in by their browser.
// (`ensureStatic = 'navigation'` would suit them, but with Next 16.4 an address not built ahead then answers
// 500, NEXT_STATIC_GEN_BAILOUT: DEVELOPERS.md "Reading a page".)

export default function OpenLayout({ children }: { children: ReactNode }) {
  return <SiteFrame corner="shared-copy">{children}</SiteFrame>;
}
