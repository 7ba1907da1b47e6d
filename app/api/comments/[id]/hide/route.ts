import { route, readJson, idParam } from '@/lib/http/route';
import { hideComment, unhideComment } from '@/lib/server/comments';


type Params = { id: string };

/** The builder or an admin hides a comment: { reason } → { comment }. */
export const POST = route<Params>(async ({ req, user, params }) => {
  const id = idParam(params);
  const body = user ? await readJson(req) : {};
  return { comment: await hideComment(user, id, body) };
});

/** Shows a hidden comment again → { comment }. */
export const DELETE = route<Params>(async ({ user, params }) => ({ comment: await unhideComment(user, idParam(params)) }));
