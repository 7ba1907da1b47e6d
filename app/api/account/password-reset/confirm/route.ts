import { route } from '@/lib/http/route';
import { resetPassword } from '@/lib/server/accounts';


/** Sets a new password with a reset link's token (single use); every session of the account ends. */
export const POST = route({ body: 'json' }, async ({ body }) => resetPassword(body));
