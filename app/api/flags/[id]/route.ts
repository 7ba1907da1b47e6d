import { route, idParam } from '@/lib/http/route';
import { updateFlag, withdrawFlag } from '@/lib/server/flags';


type Params = { id: string };

/** The mentor who raised it: { severity?, hazard?, concern?, instead?, version } → { flag }; stale → 409; answered → 409. */
export const PATCH = route<Params, unknown>({ body: 'member-json' }, async ({ user, params, body }) => {
  const id = idParam(params);
  return { flag: await updateFlag(user, id, body) };
});

/** The mentor who raised it withdraws it while it is unanswered: 204. */
export const DELETE = route<Params>(async ({ user, params }) => {
  await withdrawFlag(user, idParam(params));
  return undefined;
});
