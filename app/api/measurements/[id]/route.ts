import { z } from 'zod';
import { route, readJson } from '@/lib/http/route';
import { idSchema } from '@/lib/validations/log';
import { deleteMeasurement, getMeasurement, updateMeasurement } from '@/lib/server/measurements';

export const dynamic = 'force-dynamic';

type Params = { id: string };
const idOf = (params: Params) => z.object({ id: idSchema('id') }).parse(params).id;

/** One record, judged, with the fits it is part of: { record, pairs, canEdit, candidates }. */
export const GET = route<Params>(async ({ user, params }) => getMeasurement(user, idOf(params)));

/** { feature?, kind?, nominal?, unit?, spec?, timeNoteId?, version } → { record }; a stale version → 409. */
export const PATCH = route<Params>(async ({ req, user, params }) => {
  const id = idOf(params);
  const body = user ? await readJson(req) : {};
  return { record: await updateMeasurement(user, id, body) };
});

/** Deletes the record with its readings and fits. */
export const DELETE = route<Params>(async ({ user, params }) => {
  await deleteMeasurement(user, idOf(params));
  return undefined;
});
