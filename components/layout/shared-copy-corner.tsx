'use client';

import { useEffect, useState } from 'react';
import { MemberLinks, SignedInCorner, SignedOutCorner } from './corners';
import { loadViewer, useSharedCopyViewer } from './shared-copy-viewer';

// The header corners a browser fills in, for the pages cached for everyone and for the page of an address that
// matches nothing. One module for both: that page travels in every page's payload (the root layout's not-found
// boundary), so a corner of its own in another file was a second copy of the corners on every page (about 4 KB).

const RELOADED = 'scribeline-copy-reloaded';

/**
 * The account corner of a page cached for everyone: signed out as built, then the member's own once the
 * browser knows them. On a shared copy of the log (`followOwnCopy`), a member whose own copy differs (they
 * have since started a project, or become a mentor or an admin) is given it: the answer has already set the
 * cookie, so the page is read again once. The tools have one copy for everyone, so nothing is read again.
 */
export function SharedCopyCorner({ followOwnCopy }: { followOwnCopy: boolean }) {
  const viewer = useSharedCopyViewer();
  useEffect(() => {
    if (!followOwnCopy || viewer?.copy !== 'own') return;
    const last = Number(sessionStorage.getItem(RELOADED) ?? 0);
    if (Date.now() - last < 30_000) return;
    sessionStorage.setItem(RELOADED, String(Date.now()));
    window.location.reload();
  }, [viewer, followOwnCopy]);
  return viewer ? <SignedInCorner name={viewer.name} /> : <SignedOutCorner />;
}

/** The member's own links in the header of a page cached for everyone. */
export function SharedCopyViewerLinks() {
  const viewer = useSharedCopyViewer();
  return viewer ? <MemberLinks manageUsers={viewer.manageUsers} /> : null;
}

/**
 * The account corner of the page for an address that matches nothing, asked for by the browser. That page is
 * part of every page's payload (the root layout's not-found boundary), so a corner read on the server would
 * leave a dynamic hole in every page and keep even the signed-out copies of the log from being cached whole.
 * Asked without looking at the copy cookie first: whoever signed in before it existed is still named.
 */
export function BrowserAccountCorner() {
  const [viewer, setViewer] = useState<{ name: string } | null | undefined>(undefined);
  useEffect(() => {
    let live = true;
    void loadViewer().then((v) => live && setViewer(v));
    return () => {
      live = false;
    };
  }, []);
  if (viewer === undefined) return null;
  if (!viewer) return <SignedOutCorner />;
  return <SignedInCorner name={viewer.name} />;
}
