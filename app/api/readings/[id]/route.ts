import { route, idParam } from '@/lib/http/route';
import { deleteReading, updateReading } from '@/lib/server/measurements';


type Params = { id: string };

/** Any reading field, with { version } → { record }; a stale version → 409. */
export const PATCH = route<Params, unknown>({ body: 'member-json' }, async ({ user, params, body }) => {
  const id = idParam(params);
  return { record: await updateReading(user, id, body) };
});

/** Deletes a reading; a record's last reading stays (409): delete the record instead. */
export const DELETE = route<Params>(async ({ user, params }) => {
  await deleteReading(user, idParam(params));
  return undefined;
});
