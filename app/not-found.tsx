import { SiteHeader, mainClass } from '@/components/layout/site-header';
import { BrowserAccountCorner } from '@/components/layout/shared-copy-corner';
import { NothingHere } from '@/components/layout/nothing-here';

// An address that matches no page: shown inside the root layout alone, so it brings the header along.
// (A notFound() inside a route group is caught by that group's own not-found.tsx, within its layout.)
// Everything here is static, the account corner asked for by the browser: this page travels in the payload
// of every page under the root layout, and one dynamic hole here would leave one in each of them
// (DEVELOPERS.md, "Reading a page").
export default function NotFound() {
  return (
    <>
      <SiteHeader corner={<BrowserAccountCorner />} />
      <main id="main" className={mainClass}>
        <NothingHere />
      </main>
    </>
  );
}
