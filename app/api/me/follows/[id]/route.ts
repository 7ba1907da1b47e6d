import { route, idParam } from '@/lib/http/route';
import { deleteFollow, setFollowMail } from '@/lib/server/follows';

type Params = { id: string };

/** { mail: boolean } → { follow } */
export const PATCH = route<Params, unknown>({ auth: 'user', signInTo: 'change your settings', body: 'json' }, async ({ user, params, body }) => ({
  follow: await setFollowMail(user, idParam(params), body),
}));

export const DELETE = route<Params>(async ({ user, params }) => {
  await deleteFollow(user, idParam(params));
  return undefined;
});
