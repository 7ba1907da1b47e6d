import { NextResponse } from 'next/server';
import { route } from '@/lib/http/route';
import { signUp } from '@/lib/server/accounts';
import { clientAddress } from '@/lib/auth/options';
import { AppError } from '@/lib/errors';


/**
 * Sign-up: anyone not signed in. The answer (202, "check your mail") is the same whether or not the
 * address already has an account; the mail that follows differs.
 */
export const POST = route({ body: 'json' }, async ({ req, user, body }) => {
  if (user) throw new AppError('conflict', 'You are already signed in. Sign out to create another account.');
  return NextResponse.json(await signUp(body, clientAddress(req.headers)), { status: 202 });
});
