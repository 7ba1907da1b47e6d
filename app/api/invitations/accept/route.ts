import { route, readJson } from '@/lib/http/route';
import { acceptInvitation } from '@/lib/server/invitations';
import { unauthenticated } from '@/lib/errors';


/** { token } → { project }: the signed-in account, if it has the invited address, becomes a mentor. */
export const POST = route(async ({ req, user }) => {
  if (!user) throw unauthenticated('accept this invitation');
  return acceptInvitation(user, await readJson(req));
});
