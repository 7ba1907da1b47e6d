import { NextResponse } from 'next/server';
import { route } from '@/lib/http/route';
import { requestEmailChange } from '@/lib/server/accounts';
import { clientAddress } from '@/lib/auth/options';


/** { email, currentPassword }: the new address gets a link; nothing changes until it is followed. */
export const POST = route({ body: 'json' }, async ({ req, user, body }) =>
  NextResponse.json(await requestEmailChange(user, body, clientAddress(req.headers)), { status: 202 }),
);
