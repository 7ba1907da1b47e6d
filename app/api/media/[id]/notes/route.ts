import { route, created, idParam } from '@/lib/http/route';
import { createNote, listClipNotes } from '@/lib/server/notes';


type Params = { id: string };

/** A clip's timestamped notes in time order, a page at a time (`?limit=` 1–500, all by default; `?after=` the last page's `nextCursor`): { notes, nextCursor }. */
export const GET = route<Params>(async ({ req, user, params }) => {
  const q = req.nextUrl.searchParams;
  return listClipNotes(user, idParam(params), { after: q.get('after'), limit: q.get('limit') });
});

/** { startMs, endMs?, kind, text } → 201 { note }. */
export const POST = route<Params, unknown>({ body: 'member-json' }, async ({ user, params, body }) => {
  const id = idParam(params);
  // Signed out: let the policy answer 401 before anything is read.
  return created({ note: await createNote(user, id, body) });
});
