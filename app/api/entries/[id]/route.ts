import { route, readJson, idParam } from '@/lib/http/route';
import { deleteEntry, getEntry, updateEntry } from '@/lib/server/entries';
import { unauthenticated } from '@/lib/http/errors';

export const dynamic = 'force-dynamic';
type Params = { id: string };

export const GET = route<Params>(async ({ user, params }) => ({ entry: (await getEntry(user, idParam(params))).entry }));

/** Autosave: `{ title?, operation?, body?, version }`; a stale version is a 409. */
export const PATCH = route<Params>(async ({ req, user, params }) => {
  const id = idParam(params);
  if (!user) throw unauthenticated('change this entry');
  return { entry: await updateEntry(user, id, await readJson(req)) };
});

export const DELETE = route<Params>(async ({ user, params }) => {
  await deleteEntry(user, idParam(params));
  return undefined;
});
