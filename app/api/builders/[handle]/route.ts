import { route } from '@/lib/http/route';
import { getBuilderProfile } from '@/lib/server/profiles';

type Params = { handle: string };

/** A builder's public profile: name, handle, member since, one page of published projects with published-session counts (`?after=` the page's `nextCursor`). */
export const GET = route<Params>(async ({ req, user, params }) => ({ profile: await getBuilderProfile(user, params.handle, req.nextUrl.searchParams.get('after')) }));
