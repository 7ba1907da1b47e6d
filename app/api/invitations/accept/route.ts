import { route } from '@/lib/http/route';
import { acceptInvitation } from '@/lib/server/invitations';


/** { token } → { project }: the signed-in account, if it has the invited address, becomes a mentor. */
export const POST = route<Record<string, string>, unknown>({ auth: 'user', signInTo: 'accept this invitation', body: 'json' }, async ({ user, body }) =>
  acceptInvitation(user, body),
);
