import { route, readJson, created, idParam } from '@/lib/http/route';
import { createSession, listSessions } from '@/lib/server/sessions';
import { unauthenticated } from '@/lib/errors';

type Params = { id: string };

/** One page of the sessions the viewer is shown, in log order: { sessions, nextCursor, openFlags, total } (`?after=` the last page's `nextCursor`). */
export const GET = route<Params>(async ({ req, user, params }) => listSessions(user, idParam(params), req.nextUrl.searchParams.get('after')));

export const POST = route<Params>(async ({ req, user, params }) => {
  const id = idParam(params);
  if (!user) throw unauthenticated('log a session');
  return created({ session: await createSession(user, id, await readJson(req)) });
});
