import { route, idParam } from '@/lib/http/route';
import { resolveFlag } from '@/lib/server/flags';


type Params = { id: string };

/** The builder answers the flag: { answer, version } → { flag }; the mentor is e-mailed the answer. */
export const POST = route<Params, unknown>({ body: 'member-json' }, async ({ user, params, body }) => {
  const id = idParam(params);
  return { flag: await resolveFlag(user, id, body) };
});
