import { route, readJson, idParam } from '@/lib/http/route';
import { unauthenticated } from '@/lib/errors';
import { setSessionVisibility } from '@/lib/server/publishing';

type Params = { id: string };

/** { visibility: 'private'|'unlisted'|'published', version? } → { session, announced } (messages queued for followers). */
export const PATCH = route<Params>(async ({ req, user, params }) => {
  const id = idParam(params);
  if (!user) throw unauthenticated('publish or hide a session');
  return setSessionVisibility(user, id, await readJson(req));
});
