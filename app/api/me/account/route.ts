import { route } from '@/lib/http/route';
import { changeName, deleteAccount, getAccount } from '@/lib/server/accounts';


/** The signed-in member's own account (policy: manageOwnSettings). */
export const GET = route(async ({ user }) => getAccount(user));

/** { name } */
export const PATCH = route({ body: 'json' }, async ({ user, body }) => changeName(user, body));

/** { logs: 'remove' | 'keep', currentPassword } */
export const DELETE = route({ body: 'json' }, async ({ user, body }) => {
  await deleteAccount(user, body);
});
