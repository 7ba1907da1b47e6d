import { route, idParam } from '@/lib/http/route';
import { moveEntry } from '@/lib/server/entries';

type Params = { id: string };

/** Body `{ position, sessionId? }`: a new place in its session, or in another session of the project. */
export const POST = route<Params, unknown>({ auth: 'user', signInTo: 'move entries', body: 'json' }, async ({ user, params, body }) => ({ entries: await moveEntry(user, idParam(params), body) }));
