import { route, created, idParam } from '@/lib/http/route';
import { createSession, listSessions } from '@/lib/server/sessions';

type Params = { id: string };

/** One page of the sessions the viewer is shown, in log order: { sessions, nextCursor, openFlags, total } (`?after=` the last page's `nextCursor`). */
export const GET = route<Params>(async ({ req, user, params }) => listSessions(user, idParam(params), req.nextUrl.searchParams.get('after')));

export const POST = route<Params, unknown>({ auth: 'user', signInTo: 'log a session', body: 'json' }, async ({ user, params, body }) =>
  created({ session: await createSession(user, idParam(params), body) }),
);
