'use client';

import { useCallback, useEffect, useRef, useState } from 'react';
import { usePathname, useRouter } from 'next/navigation';

/**
 * A page's boxes, kept in the URL (the fits look-up, the calculators): written with router.replace
 * (no scroll) once typing pauses, and followed when the URL changes from outside (back and forward, a link):
 * the page then renders again with the address's boxes as `initial`. The address is read on the server,
 * not with useSearchParams, so the page's prerendered shell can hold the boxes as they start.
 */
export function useQueryState<S>(initial: S, toQuery: (s: S) => string, fromSearch: (p: URLSearchParams) => S) {
  const router = useRouter();
  const pathname = usePathname();
  const [state, setState] = useState<S>(initial);
  const written = useRef(toQuery(initial));
  // Lets browser tests wait until typing reaches React rather than the server-rendered boxes.
  const [hydrated, setHydrated] = useState(false);
  useEffect(() => setHydrated(true), []);

  const query = toQuery(state);
  useEffect(() => {
    if (query === written.current) return;
    const timer = setTimeout(() => {
      written.current = query;
      router.replace(`${pathname}${query}`, { scroll: false });
    }, 300);
    return () => clearTimeout(timer);
  }, [query, pathname, router]);

  // A new address from outside: the server's boxes for it, or (back and forward) the address itself.
  const initialQuery = toQuery(initial);
  useEffect(() => {
    const follow = (next: S) => {
      const q = toQuery(next);
      if (q === written.current) return;
      written.current = q;
      setState(next);
    };
    follow(initial);
    const onPop = () => follow(fromSearch(new URLSearchParams(window.location.search)));
    window.addEventListener('popstate', onPop);
    return () => window.removeEventListener('popstate', onPop);
    // toQuery/fromSearch are module functions and `initial` is read through its query: only the address matters here.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [initialQuery]);

  const update = useCallback((patch: Partial<S>) => setState((s) => ({ ...s, ...patch })), []);
  return { state, update, replace: setState, query, hydrated, href: `${pathname}${query}` };
}
