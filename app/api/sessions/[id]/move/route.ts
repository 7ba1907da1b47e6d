import { route, readJson, idParam } from '@/lib/http/route';
import { moveSession } from '@/lib/server/sessions';
import { unauthenticated } from '@/lib/errors';

type Params = { id: string };

/** Body `{ position }`: the session's new place in the project, from 0. */
export const POST = route<Params>(async ({ req, user, params }) => {
  const id = idParam(params);
  if (!user) throw unauthenticated('reorder sessions');
  return { sessions: await moveSession(user, id, await readJson(req)) };
});
