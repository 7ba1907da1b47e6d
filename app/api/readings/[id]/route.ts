import { z } from 'zod';
import { route, readJson } from '@/lib/http/route';
import { idSchema } from '@/lib/validations/log';
import { deleteReading, updateReading } from '@/lib/server/measurements';

export const dynamic = 'force-dynamic';

type Params = { id: string };
const idOf = (params: Params) => z.object({ id: idSchema('id') }).parse(params).id;

/** Any reading field, with { version } → { record }; a stale version → 409. */
export const PATCH = route<Params>(async ({ req, user, params }) => {
  const id = idOf(params);
  const body = user ? await readJson(req) : {};
  return { record: await updateReading(user, id, body) };
});

/** Deletes a reading; a record's last reading stays (409): delete the record instead. */
export const DELETE = route<Params>(async ({ user, params }) => {
  await deleteReading(user, idOf(params));
  return undefined;
});
