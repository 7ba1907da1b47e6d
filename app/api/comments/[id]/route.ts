import { route, readJson, idParam } from '@/lib/http/route';
import { deleteComment, updateComment } from '@/lib/server/comments';


type Params = { id: string };

/** The author's change: { body, version } → { comment }; a stale version → 409. */
export const PATCH = route<Params>(async ({ req, user, params }) => {
  const id = idParam(params);
  const body = user ? await readJson(req) : {};
  return { comment: await updateComment(user, id, body) };
});

/** The author deletes their comment (its text goes; replies keep their thread) → 204. */
export const DELETE = route<Params>(async ({ user, params }) => {
  await deleteComment(user, idParam(params));
  return undefined;
});
