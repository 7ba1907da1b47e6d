import { route, idParam } from '@/lib/http/route';
import { deleteMeasurement, getMeasurement, updateMeasurement } from '@/lib/server/measurements';


type Params = { id: string };

/** One record, judged, with the fits it is part of: { record, pairs, canEdit, candidates }. */
export const GET = route<Params>(async ({ user, params }) => getMeasurement(user, idParam(params)));

/** { feature?, kind?, nominal?, unit?, spec?, timeNoteId?, version } → { record }; a stale version → 409. */
export const PATCH = route<Params, unknown>({ body: 'member-json' }, async ({ user, params, body }) => {
  const id = idParam(params);
  return { record: await updateMeasurement(user, id, body) };
});

/** Deletes the record with its readings and fits. */
export const DELETE = route<Params>(async ({ user, params }) => {
  await deleteMeasurement(user, idParam(params));
  return undefined;
});
