import { route } from '@/lib/http/route';
import { search } from '@/lib/server/search';

/**
 * Search across the logs the viewer may list: ?q=&kind=&operation=&zone=&min=&max=&unit=&page= →
 * { mode, hits, page, hasMore, words, ignored, filters, notice }; a bad field is a 400 naming it.
 */
export const GET = route(async ({ req, user }) => search(user, Object.fromEntries(req.nextUrl.searchParams)));
