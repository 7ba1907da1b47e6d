import { route } from '@/lib/http/route';
import { listModerationQueue } from '@/lib/server/moderation';

export const dynamic = 'force-dynamic';

/** Admins: comments with open reports, and the latest hidden ones → { reported, hidden }. */
export const GET = route(async ({ user }) => listModerationQueue(user));
