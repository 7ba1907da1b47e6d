import { route, readJson, idParam } from '@/lib/http/route';
import { deleteMeasurement, getMeasurement, updateMeasurement } from '@/lib/server/measurements';


type Params = { id: string };

/** One record, judged, with the fits it is part of: { record, pairs, canEdit, candidates }. */
export const GET = route<Params>(async ({ user, params }) => getMeasurement(user, idParam(params)));

/** { feature?, kind?, nominal?, unit?, spec?, timeNoteId?, version } → { record }; a stale version → 409. */
export const PATCH = route<Params>(async ({ req, user, params }) => {
  const id = idParam(params);
  const body = user ? await readJson(req) : {};
  return { record: await updateMeasurement(user, id, body) };
});

/** Deletes the record with its readings and fits. */
export const DELETE = route<Params>(async ({ user, params }) => {
  await deleteMeasurement(user, idParam(params));
  return undefined;
});
