import { z } from 'zod';
import { route } from '@/lib/http/route';
import { idSchema } from '@/lib/validations/log';
import { deletePair } from '@/lib/server/measurements';


type Params = { pairId: string };

/** Unpairs two records; the records themselves stay. */
export const DELETE = route<Params>(async ({ user, params }) => {
  await deletePair(user, z.object({ pairId: idSchema('pairId') }).parse(params).pairId);
  return undefined;
});
