import { z } from 'zod';
import { route, readJson } from '@/lib/http/route';
import { idSchema } from '@/lib/validations/log';
import { deleteMedia, getMedia, updateMedia } from '@/lib/server/media';

export const dynamic = 'force-dynamic';

type Params = { id: string };
const idOf = (params: Params) => z.object({ id: idSchema('id') }).parse(params).id;

export const GET = route<Params>(async ({ user, params }) => ({ media: await getMedia(user, idOf(params)) }));

/** `{ caption?, position? }`: position moves it among the entry's photos (or clips), counted from 0. */
export const PATCH = route<Params>(async ({ req, user, params }) => {
  const id = idOf(params);
  return { media: await updateMedia(user, id, await readJson(req)) };
});

export const DELETE = route<Params>(async ({ user, params }) => {
  await deleteMedia(user, idOf(params));
  return undefined;
});
