import { z } from 'zod';
import { route, readJson, created } from '@/lib/http/route';
import { createEntry, listEntries } from '@/lib/server/entries';
import { idSchema } from '@/lib/validations/log';
import { unauthenticated } from '@/lib/http/errors';

export const dynamic = 'force-dynamic';
type Params = { id: string };
const idOf = (p: Params) => z.object({ id: idSchema('id') }).parse(p).id;

export const GET = route<Params>(async ({ user, params }) => ({ entries: await listEntries(user, idOf(params)) }));

export const POST = route<Params>(async ({ req, user, params }) => {
  const id = idOf(params);
  if (!user) throw unauthenticated('write an entry');
  return created({ entry: await createEntry(user, id, await readJson(req)) });
});
