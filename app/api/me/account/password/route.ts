import { route } from '@/lib/http/route';
import { changePassword } from '@/lib/server/accounts';


/** { currentPassword, newPassword }: every session ends, this one too (the form signs in again). */
export const POST = route({ body: 'json' }, async ({ user, body }) => changePassword(user, body));
