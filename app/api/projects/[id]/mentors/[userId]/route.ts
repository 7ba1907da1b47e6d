import { z } from 'zod';
import { route, idParam } from '@/lib/http/route';
import { idSchema } from '@/lib/validations/log';
import { removeMentor } from '@/lib/server/invitations';


type Params = { id: string; userId: string };

/** The builder removes a mentor: 204. */
export const DELETE = route<Params>(async ({ user, params }) => {
  const userId = z.object({ userId: idSchema('userId') }).parse({ userId: params.userId }).userId;
  await removeMentor(user, idParam(params), userId);
  return undefined;
});
