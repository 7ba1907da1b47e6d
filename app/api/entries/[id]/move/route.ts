import { route, readJson, idParam } from '@/lib/http/route';
import { moveEntry } from '@/lib/server/entries';
import { unauthenticated } from '@/lib/errors';

type Params = { id: string };

/** Body `{ position, sessionId? }`: a new place in its session, or in another session of the project. */
export const POST = route<Params>(async ({ req, user, params }) => {
  const id = idParam(params);
  if (!user) throw unauthenticated('move entries');
  return { entries: await moveEntry(user, id, await readJson(req)) };
});
