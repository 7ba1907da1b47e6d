import { route, readJson, created, idParam } from '@/lib/http/route';
import { createEntry, listEntries } from '@/lib/server/entries';
import { unauthenticated } from '@/lib/errors';

type Params = { id: string };

export const GET = route<Params>(async ({ user, params }) => ({ entries: await listEntries(user, idParam(params)) }));

export const POST = route<Params>(async ({ req, user, params }) => {
  const id = idParam(params);
  if (!user) throw unauthenticated('write an entry');
  return created({ entry: await createEntry(user, id, await readJson(req)) });
});
