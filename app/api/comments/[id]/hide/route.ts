import { route, idParam } from '@/lib/http/route';
import { hideComment, unhideComment } from '@/lib/server/comments';


type Params = { id: string };

/** The builder or an admin hides a comment: { reason } → { comment }. */
export const POST = route<Params, unknown>({ body: 'member-json' }, async ({ user, params, body }) => {
  const id = idParam(params);
  return { comment: await hideComment(user, id, body) };
});

/** Shows a hidden comment again → { comment }. */
export const DELETE = route<Params>(async ({ user, params }) => ({ comment: await unhideComment(user, idParam(params)) }));
