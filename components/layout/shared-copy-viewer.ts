'use client';

import { useEffect, useState } from 'react';
import { VIEWER_COPY_COOKIE, type ViewerView } from '@/lib/types/viewer';

// The pages cached for everyone (app/(open)) are also given to signed-in members outside the project's
// circle (lib/server/viewer.ts); what is theirs there — the account corner, follow buttons, the comment
// form and what they may do with each comment — is asked for by the browser. The scribeline-copy cookie
// tells it someone is signed in; a signed-out visitor's browser asks for nothing.

const COOKIE = new RegExp(`(?:^|;\\s*)${VIEWER_COPY_COOKIE}=([a-z]+)`);

/** The copy the scribeline-copy cookie names, or null when there is none (signed out, or never asked). */
export function viewerCopyCookie(): string | null {
  if (typeof document === 'undefined') return null;
  return COOKIE.exec(document.cookie)?.[1] ?? null;
}

let asked: Promise<ViewerView | null> | null = null;

/**
 * The signed-in member (GET /api/me/viewer, which also sets or clears the cookie), asked once per page
 * load and shared by every island; `fresh` asks again (after signing in).
 */
export function loadViewer(fresh = false): Promise<ViewerView | null> {
  if (fresh || !asked) {
    asked = fetch('/api/me/viewer', { headers: { accept: 'application/json' }, cache: 'no-store' })
      .then(async (res) => (res.ok ? (((await res.json()) as { viewer?: ViewerView | null }).viewer ?? null) : null))
      .catch(() => null);
  }
  return asked;
}

/**
 * On a shared copy (and the tools, app/(tools)): the signed-in member once known, null for a signed-out visitor, undefined while unknown.
 * The first render (and the server's) is always the signed-out view, so the HTML is the same for everyone.
 */
export function useSharedCopyViewer(): ViewerView | null | undefined {
  const [viewer, setViewer] = useState<ViewerView | null | undefined>(undefined);
  useEffect(() => {
    let live = true;
    if (!viewerCopyCookie()) {
      setViewer(null);
      return;
    }
    void loadViewer().then((v) => live && setViewer(v));
    return () => {
      live = false;
    };
  }, []);
  return viewer;
}

/** Forgets who is signed in (before signing out), so the next page read is the signed-out one. */
export function forgetViewer(): void {
  asked = null;
  document.cookie = `${VIEWER_COPY_COOKIE}=; path=/; max-age=0; samesite=lax`;
}
