import { Suspense, type ReactNode } from 'react';
import { SiteHeader, mainClass } from './site-header';
import { AccountCorner, ViewerLinks } from './account-corner';
import { SharedCopyCorner, SharedCopyViewerLinks } from './shared-copy-corner';

/**
 * The header and the main column around a group's pages. For everyone but the shared copies the viewer's
 * links and account corner are two small dynamic holes (they read the session); `shared` (the copies cached
 * for everyone, app/(open)) builds them as a signed-out reader sees them and lets the browser fill in a
 * signed-in member's, so those pages have no hole at all and are kept whole in the cache.
 */
export function SiteFrame({ shared = false, children }: { shared?: boolean; children: ReactNode }) {
  return (
    <>
      {shared ? (
        <SiteHeader viewerLinks={<SharedCopyViewerLinks />} corner={<SharedCopyCorner />} />
      ) : (
        <SiteHeader
          viewerLinks={
            <Suspense fallback={null}>
              <ViewerLinks />
            </Suspense>
          }
          corner={
            <Suspense fallback={null}>
              <AccountCorner />
            </Suspense>
          }
        />
      )}
      <main id="main" className={mainClass}>
        {children}
      </main>
    </>
  );
}
