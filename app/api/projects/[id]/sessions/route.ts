import { route, readJson, created, idParam } from '@/lib/http/route';
import { createSession, listSessions } from '@/lib/server/sessions';
import { unauthenticated } from '@/lib/errors';

export const dynamic = 'force-dynamic';
type Params = { id: string };

export const GET = route<Params>(async ({ user, params }) => ({ sessions: await listSessions(user, idParam(params)) }));

export const POST = route<Params>(async ({ req, user, params }) => {
  const id = idParam(params);
  if (!user) throw unauthenticated('log a session');
  return created({ session: await createSession(user, id, await readJson(req)) });
});
