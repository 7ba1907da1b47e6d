'use client';

import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import type { ReactNode } from 'react';

const makeClient = () => new QueryClient({ defaultOptions: { queries: { staleTime: 10_000, retry: 1 } } });
let browserClient: QueryClient | undefined;

/**
 * TanStack Query for the parts that poll or page through data (the signed-in area, the records table,
 * saving a calculation), not for every page: a reader's page loads none of it. In the browser every
 * island shares one client, so islands of one page (the uploads and the clips of an entry) share their
 * lists; on the server each render gets its own.
 */
export function QueryIsland({ children }: { children: ReactNode }) {
  const client = typeof window === 'undefined' ? makeClient() : (browserClient ??= makeClient());
  return <QueryClientProvider client={client}>{children}</QueryClientProvider>;
}
