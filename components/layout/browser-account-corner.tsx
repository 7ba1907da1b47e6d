'use client';

import { useEffect, useState } from 'react';
import { SignedInCorner, SignedOutCorner } from './corners';

/**
 * The account corner of the page for an address that matches nothing, asked for by the browser. That page is
 * part of every page's payload (the root layout's not-found boundary), so a corner read on the server would
 * leave a dynamic hole in every page and keep even the signed-out copies of the log from being cached whole.
 */
export function BrowserAccountCorner() {
  const [viewer, setViewer] = useState<{ name: string } | null | undefined>(undefined);
  useEffect(() => {
    let live = true;
    fetch('/api/me/account', { headers: { accept: 'application/json' }, cache: 'no-store' })
      .then(async (res) => (res.ok ? ((await res.json()) as { name?: string }) : null))
      .then((account) => live && setViewer(account?.name ? { name: account.name } : null))
      .catch(() => live && setViewer(null));
    return () => {
      live = false;
    };
  }, []);
  if (viewer === undefined) return null;
  if (!viewer) return <SignedOutCorner />;
  return <SignedInCorner name={viewer.name} />;
}
