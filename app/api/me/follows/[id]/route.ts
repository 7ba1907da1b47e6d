import { route, readJson, idParam } from '@/lib/http/route';
import { unauthenticated } from '@/lib/errors';
import { deleteFollow, setFollowMail } from '@/lib/server/follows';

type Params = { id: string };

/** { mail: boolean } → { follow } */
export const PATCH = route<Params>(async ({ req, user, params }) => {
  const id = idParam(params);
  if (!user) throw unauthenticated('change your settings');
  return { follow: await setFollowMail(user, id, await readJson(req)) };
});

export const DELETE = route<Params>(async ({ user, params }) => {
  await deleteFollow(user, idParam(params));
  return undefined;
});
