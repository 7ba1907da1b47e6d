import { route, idParam } from '@/lib/http/route';
import { revokeInvitation } from '@/lib/server/invitations';


type Params = { id: string };

/** The builder withdraws an invitation that was not accepted yet: its link stops working. → { invitation }. */
export const DELETE = route<Params>(async ({ user, params }) => ({ invitation: await revokeInvitation(user, idParam(params)) }));
