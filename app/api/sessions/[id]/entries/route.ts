import { route, created, idParam } from '@/lib/http/route';
import { createEntry, listEntries } from '@/lib/server/entries';

type Params = { id: string };

export const GET = route<Params>(async ({ user, params }) => ({ entries: await listEntries(user, idParam(params)) }));

export const POST = route<Params, unknown>({ auth: 'user', signInTo: 'write an entry', body: 'json' }, async ({ user, params, body }) =>
  created({ entry: await createEntry(user, idParam(params), body) }),
);
