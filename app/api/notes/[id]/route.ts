import { z } from 'zod';
import { route, readJson } from '@/lib/http/route';
import { idSchema } from '@/lib/validations/log';
import { deleteNote, updateNote } from '@/lib/server/notes';

export const dynamic = 'force-dynamic';

type Params = { id: string };
const idOf = (params: Params) => z.object({ id: idSchema('id') }).parse(params).id;

/** { startMs?, endMs?, kind?, text?, version } → { note }; a stale version → 409. */
export const PATCH = route<Params>(async ({ req, user, params }) => {
  const id = idOf(params);
  const body = user ? await readJson(req) : {};
  return { note: await updateNote(user, id, body) };
});

export const DELETE = route<Params>(async ({ user, params }) => {
  await deleteNote(user, idOf(params));
  return undefined;
});
