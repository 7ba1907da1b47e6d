import { route, idParam } from '@/lib/http/route';
import { setSessionVisibility } from '@/lib/server/publishing';

type Params = { id: string };

/** { visibility: 'private'|'unlisted'|'published', version? } → { session, announced } (messages queued for followers). */
export const PATCH = route<Params, unknown>({ auth: 'user', signInTo: 'publish or hide a session', body: 'json' }, async ({ user, params, body }) =>
  setSessionVisibility(user, idParam(params), body),
);
