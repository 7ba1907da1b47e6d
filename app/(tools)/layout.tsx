import type { ReactNode } from 'react';
import { SiteFrame } from '@/components/layout/site-frame';

// The tools (limits and fits, the calculators) are the same for everyone: each page is prerendered whole at
// build, with the header a signed-out visitor sees; a member's corner is filled in by their browser. An
// address that holds boxes (?q=…), marked by proxy.ts, is rewritten by next.config.mjs to the page's
// from-address twin, which renders the boxes on the server (DEVELOPERS.md, "Reading a page").
export default function ToolsLayout({ children }: { children: ReactNode }) {
  return <SiteFrame corner="browser">{children}</SiteFrame>;
}
