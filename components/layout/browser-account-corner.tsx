'use client';

import { useEffect, useState } from 'react';
import { SignedInCorner, SignedOutCorner } from './corners';
import { loadViewer } from './shared-copy-viewer';

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
