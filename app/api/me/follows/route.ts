import { route, readJson } from '@/lib/http/route';
import { unauthenticated } from '@/lib/errors';
import { listMyFollows, setAllFollowMail } from '@/lib/server/follows';

export const dynamic = 'force-dynamic';

export const GET = route(async ({ user }) => ({ follows: await listMyFollows(user) }));

/** { mail: boolean } for every follow at once, e.g. "all follow e-mail off". */
export const PATCH = route(async ({ req, user }) => {
  if (!user) throw unauthenticated('change your settings');
  const body = await readJson(req);
  const { changed } = await setAllFollowMail(user, body);
  return { changed, follows: await listMyFollows(user) };
});
