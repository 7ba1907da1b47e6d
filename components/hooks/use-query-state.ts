'use client';

import { useCallback, useEffect, useRef, useState } from 'react';
import { usePathname } from 'next/navigation';

/**
 * A page's boxes, kept in the URL (the fits look-up, the calculators): written with history.replaceState
 * (which Next's router follows, with no request to the server) once typing pauses, and followed when the URL
 * changes from outside (back and forward, a link). The tools are prerendered with empty boxes; an address
 * that holds boxes is rendered on the server by the page's from-address twin and arrives here as `initial`
 * (lib/http/tool-addresses.mjs). Whatever the server did not read (an emptied box, ?thread=) is read from the
 * address once the page is live.
 */
export function useQueryState<S>(initial: S, toQuery: (s: S) => string, fromSearch: (p: URLSearchParams) => S) {
  const pathname = usePathname();
  const [state, setState] = useState<S>(initial);
  const written = useRef(toQuery(initial));
  // Lets browser tests wait until typing reaches React rather than the server-rendered boxes.
  const [hydrated, setHydrated] = useState(false);

  const query = toQuery(state);
  useEffect(() => {
    if (query === written.current) return;
    const timer = setTimeout(() => {
      written.current = query;
      window.history.replaceState(null, '', `${pathname}${query}${window.location.hash}`);
    }, 300);
    return () => clearTimeout(timer);
  }, [query, pathname]);

  // The address itself (on arrival, back and forward), or the boxes of a new address the server rendered.
  const initialQuery = toQuery(initial);
  useEffect(() => {
    const follow = (next: S) => {
      const q = toQuery(next);
      if (q === written.current) return;
      written.current = q;
      setState(next);
    };
    follow(initial);
    const fromAddress = () => follow(fromSearch(new URLSearchParams(window.location.search)));
    fromAddress();
    setHydrated(true);
    window.addEventListener('popstate', fromAddress);
    return () => window.removeEventListener('popstate', fromAddress);
    // toQuery/fromSearch are module functions and `initial` is read through its query: only the address matters here.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [initialQuery]);

  const update = useCallback((patch: Partial<S>) => setState((s) => ({ ...s, ...patch })), []);
  return { state, update, replace: setState, query, hydrated, href: `${pathname}${query}` };
}
