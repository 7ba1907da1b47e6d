import { route, readJson, created } from '@/lib/http/route';
import { createPair } from '@/lib/server/measurements';


/** { holeRecordId, shaftRecordId } → 201 { pair }: an inside and an outside record of the same project and nominal size. */
export const POST = route(async ({ req, user }) => {
  const body = user ? await readJson(req) : {};
  return created({ pair: await createPair(user, body) });
});
