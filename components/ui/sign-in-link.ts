'use client';

import { useEffect, useState } from 'react';

/** The sign-in page, coming back to `here` (a path on this site, with its query and #fragment) afterwards. */
export function signInHref(here: string): string {
  return `/sign-in?next=${encodeURIComponent(here)}`;
}

/**
 * A sign-in link that returns to the very page the reader is on, query and fragment included: `fallback`
 * while rendering on the server, the browser's own location once mounted.
 */
export function useSignInHref(fallback: string): string {
  const [here, setHere] = useState(fallback);
  useEffect(() => {
    const sync = () => setHere(`${window.location.pathname}${window.location.search}${window.location.hash || new URL(fallback, window.location.origin).hash}`);
    sync();
    window.addEventListener('popstate', sync);
    window.addEventListener('hashchange', sync);
    return () => {
      window.removeEventListener('popstate', sync);
      window.removeEventListener('hashchange', sync);
    };
  }, [fallback]);
  return signInHref(here);
}
