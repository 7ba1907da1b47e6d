import { z } from 'zod';
import { route, readJson } from '@/lib/http/route';
import { deleteEntry, getEntry, updateEntry } from '@/lib/server/entries';
import { idSchema } from '@/lib/validations/log';
import { unauthenticated } from '@/lib/http/errors';

export const dynamic = 'force-dynamic';
type Params = { id: string };
const idOf = (p: Params) => z.object({ id: idSchema('id') }).parse(p).id;

export const GET = route<Params>(async ({ user, params }) => ({ entry: (await getEntry(user, idOf(params))).entry }));

/** Autosave: `{ title?, operation?, body?, version }`; a stale version is a 409. */
export const PATCH = route<Params>(async ({ req, user, params }) => {
  const id = idOf(params);
  if (!user) throw unauthenticated('change this entry');
  return { entry: await updateEntry(user, id, await readJson(req)) };
});

export const DELETE = route<Params>(async ({ user, params }) => {
  await deleteEntry(user, idOf(params));
  return undefined;
});
