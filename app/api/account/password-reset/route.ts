import { NextResponse } from 'next/server';
import { route } from '@/lib/http/route';
import { requestPasswordReset } from '@/lib/server/accounts';
import { clientAddress } from '@/lib/auth/options';


/** Asks for a reset link: 202 with the same answer whether or not the address has an account. */
export const POST = route({ body: 'json' }, async ({ req, body }) =>
  NextResponse.json(await requestPasswordReset(body, clientAddress(req.headers)), { status: 202 }),
);
