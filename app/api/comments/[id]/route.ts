import { route, idParam } from '@/lib/http/route';
import { deleteComment, updateComment } from '@/lib/server/comments';


type Params = { id: string };

/** The author's change: { body, version } → { comment }; a stale version → 409. */
export const PATCH = route<Params, unknown>({ body: 'member-json' }, async ({ user, params, body }) => {
  const id = idParam(params);
  return { comment: await updateComment(user, id, body) };
});

/** The author deletes their comment (its text goes; replies keep their thread) → 204. */
export const DELETE = route<Params>(async ({ user, params }) => {
  await deleteComment(user, idParam(params));
  return undefined;
});
