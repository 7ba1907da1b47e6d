import { route, created } from '@/lib/http/route';
import { createPair } from '@/lib/server/measurements';


/** { holeRecordId, shaftRecordId } → 201 { pair }: an inside and an outside record of the same project and nominal size. */
export const POST = route<Record<string, string>, unknown>({ body: 'member-json' }, async ({ user, body }) => {
  return created({ pair: await createPair(user, body) });
});
