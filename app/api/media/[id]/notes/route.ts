import { z } from 'zod';
import { route, readJson, created } from '@/lib/http/route';
import { idSchema } from '@/lib/validations/log';
import { createNote, listClipNotes } from '@/lib/server/notes';

export const dynamic = 'force-dynamic';

type Params = { id: string };
const idOf = (params: Params) => z.object({ id: idSchema('id') }).parse(params).id;

/** A clip's timestamped notes in time order: { notes: NoteView[] }. */
export const GET = route<Params>(async ({ user, params }) => ({ notes: await listClipNotes(user, idOf(params)) }));

/** { startMs, endMs?, kind, text } → 201 { note }. */
export const POST = route<Params>(async ({ req, user, params }) => {
  const id = idOf(params);
  // Signed out: let the policy answer 401 before anything is read.
  const body = user ? await readJson(req) : {};
  return created({ note: await createNote(user, id, body) });
});
