import { route, created, idParam } from '@/lib/http/route';
import { createFlag, listEntryFlags } from '@/lib/server/flags';


type Params = { id: string };

/** The entry's risk flags, on the entry, its notes and its measurement records: { flags }. */
export const GET = route<Params>(async ({ user, params }) => ({ flags: await listEntryFlags(user, idParam(params)) }));

/** { target: 'entry' | { noteId } | { recordId }, severity, hazard, concern, instead } → 201 { flag }. Mentors only. */
export const POST = route<Params, unknown>({ body: 'member-json' }, async ({ user, params, body }) => {
  const id = idParam(params);
  return created({ flag: await createFlag(user, id, body) });
});
