import { route, idParam } from '@/lib/http/route';
import { moveSession } from '@/lib/server/sessions';

type Params = { id: string };

/** Body `{ position }`: the session's new place in the project, from 0. */
export const POST = route<Params, unknown>({ auth: 'user', signInTo: 'reorder sessions', body: 'json' }, async ({ user, params, body }) => ({ sessions: await moveSession(user, idParam(params), body) }));
