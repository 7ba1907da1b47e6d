import { route, readJson, idParam } from '@/lib/http/route';
import { deleteReading, updateReading } from '@/lib/server/measurements';


type Params = { id: string };

/** Any reading field, with { version } → { record }; a stale version → 409. */
export const PATCH = route<Params>(async ({ req, user, params }) => {
  const id = idParam(params);
  const body = user ? await readJson(req) : {};
  return { record: await updateReading(user, id, body) };
});

/** Deletes a reading; a record's last reading stays (409): delete the record instead. */
export const DELETE = route<Params>(async ({ user, params }) => {
  await deleteReading(user, idParam(params));
  return undefined;
});
