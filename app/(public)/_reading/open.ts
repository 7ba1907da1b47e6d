import { notFound } from 'next/navigation';

/**
 * The signed-out copies under app/(open)/open are built once per address and kept until a write expires
 * them. Cache Components wants one address per page at build time; this one names nothing and is the 404
 * page without asking the database, so the build never needs it.
 */
export const PLACEHOLDER = '_';

export function refusePlaceholder(...values: string[]): void {
  if (values.includes(PLACEHOLDER)) notFound();
}
