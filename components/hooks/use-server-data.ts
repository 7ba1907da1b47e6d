'use client';

import { useCallback, useEffect, useRef, useState } from 'react';

export type ServerData<T> = {
  data: T | undefined;
  error: Error | null;
  /** A read is on its way (at first, when the page brought nothing). */
  fetching: boolean;
  /** Reads the data again from its route; an answer overtaken by a newer read is dropped. */
  refresh: () => void;
  /** Changes the data in place at once, e.g. with what a write answered, before the next refresh. */
  update: (change: (old: T | undefined) => T | undefined) => void;
};

/**
 * What the server already rendered into the page, held in the browser for a reader's page: shown as
 * it came, nothing fetched again on arrival (only when the page brought nothing), changed in place
 * after a write and read again when asked. The pages that poll or page through data use TanStack
 * Query (QueryIsland); a reader's page loads none of it.
 */
export function useServerData<T>(initial: T | undefined, load: () => Promise<T>): ServerData<T> {
  const [data, setData] = useState<T | undefined>(initial);
  const [error, setError] = useState<Error | null>(null);
  const [fetching, setFetching] = useState(initial === undefined);
  const latest = useRef(0);
  const loader = useRef(load);
  useEffect(() => {
    loader.current = load;
  });

  const refresh = useCallback(() => {
    const ticket = ++latest.current;
    setFetching(true);
    loader.current().then(
      (next) => {
        if (ticket !== latest.current) return;
        setData(next);
        setError(null);
        setFetching(false);
      },
      (err: unknown) => {
        if (ticket !== latest.current) return;
        setError(err instanceof Error ? err : new Error(String(err)));
        setFetching(false);
      },
    );
  }, []);

  const broughtNothing = useRef(initial === undefined);
  useEffect(() => {
    if (broughtNothing.current) refresh();
  }, [refresh]);

  const update = useCallback((change: (old: T | undefined) => T | undefined) => setData(change), []);
  return { data, error, fetching, refresh, update };
}

export type ServerPages<P> = {
  /** The pages read so far, in order (undefined until the first has come). */
  data: { pages: P[] } | undefined;
  error: Error | null;
  fetching: boolean;
  fetchingMore: boolean;
  /** Reads the next page after the last one read (nothing when the last one has no next). */
  loadMore: () => void;
  /** Reads again as many pages as are shown, in order, each after the one before it. */
  refresh: () => void;
  update: (change: (old: { pages: P[] } | undefined) => { pages: P[] } | undefined) => void;
};

/**
 * A keyset-paged list the server rendered the first page of: more pages on request ("Show more"), the
 * pages shown read again in order on refresh. Like useServerData, nothing is fetched on arrival when the
 * page brought its first page.
 */
export function useServerPages<P>(initial: P | undefined, load: (after: string | null) => Promise<P>, nextCursor: (page: P) => string | null): ServerPages<P> {
  const [data, setData] = useState<{ pages: P[] } | undefined>(initial === undefined ? undefined : { pages: [initial] });
  const [error, setError] = useState<Error | null>(null);
  const [fetching, setFetching] = useState(initial === undefined);
  const [fetchingMore, setFetchingMore] = useState(false);
  const latest = useRef(0);
  const shown = useRef(data);
  shown.current = data;
  const io = useRef({ load, nextCursor });
  useEffect(() => {
    io.current = { load, nextCursor };
  });

  type Pages = { pages: P[] } | undefined;
  const run = useCallback((read: () => Promise<(old: Pages) => Pages>, more: boolean) => {
    const ticket = ++latest.current;
    if (more) setFetchingMore(true);
    else setFetching(true);
    read().then(
      (next) => {
        if (ticket !== latest.current) return;
        setData(next);
        setError(null);
        setFetching(false);
        setFetchingMore(false);
      },
      (err: unknown) => {
        if (ticket !== latest.current) return;
        setError(err instanceof Error ? err : new Error(String(err)));
        setFetching(false);
        setFetchingMore(false);
      },
    );
  }, []);

  const refresh = useCallback(() => {
    const count = Math.max(1, shown.current?.pages.length ?? 1);
    run(async () => {
      const pages: P[] = [];
      let after: string | null = null;
      for (let i = 0; i < count; i++) {
        const page = await io.current.load(after);
        pages.push(page);
        after = io.current.nextCursor(page);
        if (after === null) break;
      }
      return () => ({ pages });
    }, false);
  }, [run]);

  const loadMore = useCallback(() => {
    const pages = shown.current?.pages ?? [];
    const after = pages.length ? io.current.nextCursor(pages[pages.length - 1]!) : null;
    if (pages.length && after === null) return;
    run(async () => {
      const page = await io.current.load(after);
      return (old) => ({ pages: [...(old?.pages ?? []), page] });
    }, true);
  }, [run]);

  const broughtNothing = useRef(initial === undefined);
  useEffect(() => {
    if (broughtNothing.current) refresh();
  }, [refresh]);

  const update = useCallback((change: (old: { pages: P[] } | undefined) => { pages: P[] } | undefined) => setData(change), []);
  return { data, error, fetching, fetchingMore, loadMore, refresh, update };
}
