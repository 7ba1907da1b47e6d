import { NextResponse } from 'next/server';
import { route } from '@/lib/http/route';
import { resendVerification } from '@/lib/server/accounts';
import { clientAddress } from '@/lib/auth/options';


/** Sends the verification link again to the signed-in member's address. { next? } */
export const POST = route({ body: 'json' }, async ({ req, user, body }) =>
  NextResponse.json(await resendVerification(user, body, clientAddress(req.headers)), { status: 202 }),
);
