import { route, readJson, created, idParam } from '@/lib/http/route';
import { createComment, listEntryComments } from '@/lib/server/comments';

export const dynamic = 'force-dynamic';

type Params = { id: string };

/** An entry's comments as the viewer may see them: CommentsPayload. */
export const GET = route<Params>(async ({ user, params }) => listEntryComments(user, idParam(params)));

/** { body, parentId?, mediaId?, atMs? } → 201 { comment }. */
export const POST = route<Params>(async ({ req, user, params }) => {
  const id = idParam(params);
  // Signed out: let the policy answer 401 before anything is read.
  const body = user ? await readJson(req) : {};
  return created({ comment: await createComment(user, id, body) });
});
