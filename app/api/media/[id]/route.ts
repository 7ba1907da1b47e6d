import { route, idParam } from '@/lib/http/route';
import { deleteMedia, getMedia, updateMedia } from '@/lib/server/media';


type Params = { id: string };

export const GET = route<Params>(async ({ user, params }) => ({ media: await getMedia(user, idParam(params)) }));

/** `{ caption?, position? }`: position moves it among the entry's photos (or clips), counted from 0. */
export const PATCH = route<Params, unknown>({ body: 'json' }, async ({ user, params, body }) => ({ media: await updateMedia(user, idParam(params), body) }));

export const DELETE = route<Params>(async ({ user, params }) => {
  await deleteMedia(user, idParam(params));
  return undefined;
});
