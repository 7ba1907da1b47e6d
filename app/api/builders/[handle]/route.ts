import { route } from '@/lib/http/route';
import { getBuilderProfile } from '@/lib/server/profiles';

export const dynamic = 'force-dynamic';
type Params = { handle: string };

/** A builder's public profile: name, handle, member since, published projects with published-session counts. */
export const GET = route<Params>(async ({ user, params }) => ({ profile: await getBuilderProfile(user, params.handle) }));
