'use client';

import { useCallback, useEffect, useRef, useState } from 'react';
import { usePathname, useRouter, useSearchParams } from 'next/navigation';

/**
 * A page's boxes, kept in the URL (the fits look-up, the calculators): written with router.replace
 * (no scroll) once typing pauses, and followed when the URL changes from outside (back and forward, a link).
 */
export function useQueryState<S>(initial: S, toQuery: (s: S) => string, fromSearch: (p: URLSearchParams) => S) {
  const router = useRouter();
  const pathname = usePathname();
  const searchParams = useSearchParams();
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

  useEffect(() => {
    const fromUrl = fromSearch(searchParams);
    const q = toQuery(fromUrl);
    if (q === written.current) return;
    written.current = q;
    setState(fromUrl);
    // toQuery/fromSearch are module functions: only the URL matters here.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [searchParams]);

  const update = useCallback((patch: Partial<S>) => setState((s) => ({ ...s, ...patch })), []);
  return { state, update, replace: setState, query, hydrated, href: `${pathname}${query}` };
}
