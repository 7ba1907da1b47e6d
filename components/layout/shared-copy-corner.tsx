'use client';

import { useEffect } from 'react';
import { MemberLinks, SignedInCorner, SignedOutCorner } from './corners';
import { useSharedCopyViewer } from './shared-copy-viewer';

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
