import { route, created, idParam } from '@/lib/http/route';
import { addClipLink, listEntryMedia } from '@/lib/server/media';


type Params = { id: string };

/** The entry's photos and clips, in order. */
export const GET = route<Params>(async ({ user, params }) => ({ media: await listEntryMedia(user, idParam(params)) }));

/** Adds a clip that is a link to a video published elsewhere: `{ url, name? }`. Files arrive through /api/uploadthing. */
export const POST = route<Params, unknown>({ body: 'json' }, async ({ user, params, body }) =>
  created({ media: await addClipLink(user, idParam(params), body) }),
);
