import { route, created, idParam } from '@/lib/http/route';
import { createInvitation, listMentorsOverview } from '@/lib/server/invitations';


type Params = { id: string };

/** The builder's view: { mentors, invitations } (pending and expired ones, newest first). */
export const GET = route<Params>(async ({ user, params }) => listMentorsOverview(user, idParam(params)));

/** { email, note? } → 201 { invitation }; the e-mail with the signed link goes out through the outbox. Inviting again = resending. */
export const POST = route<Params, unknown>({ body: 'member-json' }, async ({ user, params, body }) => {
  const id = idParam(params);
  // Signed out: let the policy answer 401 before anything is read.
  return created({ invitation: await createInvitation(user, id, body) });
});
