'use server';

import { revalidatePath } from 'next/cache';
import { authedAction } from './authed';
import { authorizeSite } from '../auth/policy';
import { setSiteRole } from '../server/users';
import { setSiteRoleSchema } from '../validations/user';

export const setSiteRoleAction = authedAction<FormData>(async (user, form) => {
  authorizeSite(user, 'manageUsers');
  const { userId, siteRole } = setSiteRoleSchema.parse(Object.fromEntries(form));
  const updated = await setSiteRole(userId, siteRole);
  revalidatePath('/admin/users');
  return { ok: true, message: `${updated.name} is now ${updated.siteRole === 'admin' ? 'an admin' : 'a member'}.` };
});
