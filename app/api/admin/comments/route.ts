import { route } from '@/lib/http/route';
import { listModerationQueue } from '@/lib/server/moderation';


/** Admins: comments with open reports, and the latest hidden ones → { reported, hidden }. */
export const GET = route(async ({ user }) => listModerationQueue(user));
