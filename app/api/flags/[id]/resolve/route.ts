import { route, readJson, idParam } from '@/lib/http/route';
import { resolveFlag } from '@/lib/server/flags';


type Params = { id: string };

/** The builder answers the flag: { answer, version } → { flag }; the mentor is e-mailed the answer. */
export const POST = route<Params>(async ({ req, user, params }) => {
  const id = idParam(params);
  const body = user ? await readJson(req) : {};
  return { flag: await resolveFlag(user, id, body) };
});
