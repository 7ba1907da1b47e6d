import { z } from 'zod';
import { route, readJson } from '@/lib/http/route';
import { moveSession } from '@/lib/server/sessions';
import { idSchema } from '@/lib/validations/log';
import { unauthenticated } from '@/lib/http/errors';

export const dynamic = 'force-dynamic';
type Params = { id: string };

/** Body `{ position }`: the session's new place in the project, from 0. */
export const POST = route<Params>(async ({ req, user, params }) => {
  const id = z.object({ id: idSchema('id') }).parse(params).id;
  if (!user) throw unauthenticated('reorder sessions');
  return { sessions: await moveSession(user, id, await readJson(req)) };
});
