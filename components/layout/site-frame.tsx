import { Suspense, type ReactNode } from 'react';
import { SiteHeader, mainClass } from './site-header';
import { AccountCorner, ViewerLinks } from './account-corner';
import { SignedOutCorner } from './corners';

/**
 * The header and the main column around a group's pages. For everyone but the signed-out copies the viewer's
 * links and account corner are two small dynamic holes (they read the session); `signedOut` fills them with
 * what a signed-out reader sees, so those pages have no hole at all and are kept whole in the cache.
 */
export function SiteFrame({ signedOut = false, children }: { signedOut?: boolean; children: ReactNode }) {
  return (
    <>
      {signedOut ? (
        <SiteHeader corner={<SignedOutCorner />} />
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
