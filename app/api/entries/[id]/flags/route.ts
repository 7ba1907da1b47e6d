import { route, readJson, created, idParam } from '@/lib/http/route';
import { createFlag, listEntryFlags } from '@/lib/server/flags';


type Params = { id: string };

/** The entry's risk flags, on the entry, its notes and its measurement records: { flags }. */
export const GET = route<Params>(async ({ user, params }) => ({ flags: await listEntryFlags(user, idParam(params)) }));

/** { target: 'entry' | { noteId } | { recordId }, severity, hazard, concern, instead } → 201 { flag }. Mentors only. */
export const POST = route<Params>(async ({ req, user, params }) => {
  const id = idParam(params);
  const body = user ? await readJson(req) : {};
  return created({ flag: await createFlag(user, id, body) });
});
