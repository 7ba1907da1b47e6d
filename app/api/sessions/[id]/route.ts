import { z } from 'zod';
import { route, readJson } from '@/lib/http/route';
import { deleteSession, getSession, updateSession } from '@/lib/server/sessions';
import { idSchema } from '@/lib/validations/log';
import { unauthenticated } from '@/lib/http/errors';

export const dynamic = 'force-dynamic';
type Params = { id: string };
const idOf = (p: Params) => z.object({ id: idSchema('id') }).parse(p).id;

export const GET = route<Params>(async ({ user, params }) => ({ session: (await getSession(user, idOf(params))).session }));

export const PATCH = route<Params>(async ({ req, user, params }) => {
  const id = idOf(params);
  if (!user) throw unauthenticated('change this session');
  return { session: await updateSession(user, id, await readJson(req)) };
});

export const DELETE = route<Params>(async ({ user, params }) => {
  await deleteSession(user, idOf(params));
  return undefined;
});
