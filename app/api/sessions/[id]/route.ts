import { route, readJson, idParam } from '@/lib/http/route';
import { deleteSession, getSession, updateSession } from '@/lib/server/sessions';
import { unauthenticated } from '@/lib/errors';

type Params = { id: string };

export const GET = route<Params>(async ({ user, params }) => ({ session: (await getSession(user, idParam(params))).session }));

export const PATCH = route<Params>(async ({ req, user, params }) => {
  const id = idParam(params);
  if (!user) throw unauthenticated('change this session');
  return { session: await updateSession(user, id, await readJson(req)) };
});

export const DELETE = route<Params>(async ({ user, params }) => {
  await deleteSession(user, idParam(params));
  return undefined;
});
