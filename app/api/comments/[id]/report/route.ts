import { route, idParam } from '@/lib/http/route';
import { reportComment } from '@/lib/server/moderation';


type Params = { id: string };

/** A member reports a comment to the admins: { reason } → { reported, alreadyReported }. */
export const POST = route<Params>({ auth: 'user', signInTo: 'report a comment', body: 'json' }, async ({ user, params, body }) =>
  reportComment(user, idParam(params), body),
);
