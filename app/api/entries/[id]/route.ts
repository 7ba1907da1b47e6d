import { route, idParam } from '@/lib/http/route';
import { deleteEntry, getEntry, updateEntry } from '@/lib/server/entries';

type Params = { id: string };

export const GET = route<Params>(async ({ user, params }) => ({ entry: (await getEntry(user, idParam(params))).entry }));

// An entry's ProseMirror JSON is the largest body we take; photos are links to uploads, not inline data.
const ENTRY_MAX_BYTES = 1024 * 1024;

/** Autosave: `{ title?, operation?, body?, version }`; a stale version is a 409. */
export const PATCH = route<Params, unknown>(
  { auth: 'user', signInTo: 'change this entry', body: 'json', maxBytes: ENTRY_MAX_BYTES },
  async ({ user, params, body }) => ({ entry: await updateEntry(user, idParam(params), body) }),
);

export const DELETE = route<Params>(async ({ user, params }) => {
  await deleteEntry(user, idParam(params));
  return undefined;
});
