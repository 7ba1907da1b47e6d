import { Suspense, type ReactNode } from 'react';
import { SiteHeader, mainClass } from './site-header';
import { AccountCorner, ViewerLinks } from './account-corner';
import { SharedCopyCorner, SharedCopyViewerLinks } from './shared-copy-corner';

/**
 * Who fills in the viewer's links and account corner: `session`, two small dynamic holes that read the
 * session; `shared-copy` (the copies of the log cached for everyone, app/(open)) and `browser` (the tools,
 * app/(tools), the same for everyone and prerendered whole at build) build them as a signed-out reader sees
 * them and let the browser fill in a signed-in member's, so those pages have no hole at all. A member whose
 * own copy of a shared page differs is sent to it; the tools have no other copy.
 */
export type CornerFill = 'session' | 'shared-copy' | 'browser';

export function SiteFrame({ corner = 'session', children }: { corner?: CornerFill; children: ReactNode }) {
  return (
    <>
      {corner !== 'session' ? (
        <SiteHeader viewerLinks={<SharedCopyViewerLinks />} corner={<SharedCopyCorner followOwnCopy={corner === 'shared-copy'} />} />
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
