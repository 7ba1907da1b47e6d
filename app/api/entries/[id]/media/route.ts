import { z } from 'zod';
import { route, readJson, created } from '@/lib/http/route';
import { idSchema } from '@/lib/validations/log';
import { addClipLink, listEntryMedia } from '@/lib/server/media';

export const dynamic = 'force-dynamic';

type Params = { id: string };
const entryIdOf = (params: Params) => z.object({ id: idSchema('id') }).parse(params).id;

/** The entry's photos and clips, in order. */
export const GET = route<Params>(async ({ user, params }) => ({ media: await listEntryMedia(user, entryIdOf(params)) }));

/** Adds a clip that is a link to a video published elsewhere: `{ url, name? }`. Files arrive through /api/uploadthing. */
export const POST = route<Params>(async ({ req, user, params }) => {
  const entryId = entryIdOf(params);
  return created({ media: await addClipLink(user, entryId, await readJson(req)) });
});
