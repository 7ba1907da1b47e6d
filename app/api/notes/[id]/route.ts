import { route, idParam } from '@/lib/http/route';
import { deleteNote, updateNote } from '@/lib/server/notes';


type Params = { id: string };

/** { startMs?, endMs?, kind?, text?, version } → { note }; a stale version → 409. */
export const PATCH = route<Params, unknown>({ body: 'member-json' }, async ({ user, params, body }) => {
  const id = idParam(params);
  return { note: await updateNote(user, id, body) };
});

export const DELETE = route<Params>(async ({ user, params }) => {
  await deleteNote(user, idParam(params));
  return undefined;
});
