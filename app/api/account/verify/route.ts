import { route } from '@/lib/http/route';
import { confirmAddress } from '@/lib/server/accounts';


/** Follows an e-mailed address link (a new account's, or a new address's): the signed token is the proof. */
export const POST = route({ body: 'json' }, async ({ body }) => confirmAddress(body));
