import { route, idParam } from '@/lib/http/route';
import { deleteSession, getSession, updateSession } from '@/lib/server/sessions';

type Params = { id: string };

export const GET = route<Params>(async ({ user, params }) => ({ session: (await getSession(user, idParam(params))).session }));

export const PATCH = route<Params, unknown>({ auth: 'user', signInTo: 'change this session', body: 'json' }, async ({ user, params, body }) => ({ session: await updateSession(user, idParam(params), body) }));

export const DELETE = route<Params>(async ({ user, params }) => {
  await deleteSession(user, idParam(params));
  return undefined;
});
