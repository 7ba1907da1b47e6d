import { route, created, idParam } from '@/lib/http/route';
import { createComment, listEntryComments } from '@/lib/server/comments';


type Params = { id: string };

/** One page of an entry's comments as the viewer may see them (`?after=` the last page's `nextCursor`): CommentsPayload. */
export const GET = route<Params>(async ({ req, user, params }) => listEntryComments(user, idParam(params), req.nextUrl.searchParams.get('after')));

/** { body, parentId?, mediaId?, atMs? } → 201 { comment }. */
export const POST = route<Params, unknown>({ body: 'member-json' }, async ({ user, params, body }) => {
  const id = idParam(params);
  // Signed out: let the policy answer 401 before anything is read.
  return created({ comment: await createComment(user, id, body) });
});
