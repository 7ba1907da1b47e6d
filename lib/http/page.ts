import 'server-only';
import { notFound } from 'next/navigation';
import { AppError } from '../errors';

/** For pages: a missing row, or one the viewer may not see, is the 404 page. */
export async function orNotFound<T>(load: Promise<T>): Promise<T> {
  try {
    return await load;
  } catch (err) {
    if (err instanceof AppError && (err.code === 'not_found' || err.code === 'unauthenticated')) notFound();
    throw err;
  }
}

/** A positive whole-number id from a URL segment, or the 404 page. */
export function idOrNotFound(segment: string): number {
  const id = Number(segment);
  if (!Number.isInteger(id) || id <= 0) notFound();
  return id;
}
