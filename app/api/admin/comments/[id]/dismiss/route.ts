import { route, idParam } from '@/lib/http/route';
import { dismissReports } from '@/lib/server/moderation';


type Params = { id: string };

/** Admins: dismiss the comment's open reports, leaving the comment as it is → { dismissed }. */
export const POST = route<Params>(async ({ user, params }) => dismissReports(user, idParam(params)));
