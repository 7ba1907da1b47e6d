import { route } from '@/lib/http/route';
import { listMyFollows, setAllFollowMail } from '@/lib/server/follows';


/** What the member follows, newest first, 50 a page (`?after=` the last page's `nextCursor`): { follows, nextCursor }. */
export const GET = route(async ({ req, user }) => listMyFollows(user, req.nextUrl.searchParams.get('after')));

/** { mail: boolean } for every follow at once, e.g. "all follow e-mail off". */
export const PATCH = route<Record<string, string>, unknown>({ auth: 'user', signInTo: 'change your settings', body: 'json' }, async ({ user, body }) => {
  const { changed } = await setAllFollowMail(user, body);
  // The first page again, as the settings show it after the change.
  return { changed, ...(await listMyFollows(user)) };
});
