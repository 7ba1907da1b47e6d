import { route } from '@/lib/http/route';
import { searchAccounts } from '@/lib/server/moderation';


/** Admins: accounts searched by name, e-mail or handle, a page at a time: ?q=&page= → { accounts, total, page, pages, q }. */
export const GET = route(async ({ req, user }) => searchAccounts(user, Object.fromEntries(req.nextUrl.searchParams)));
