import { route, readJson, created } from '@/lib/http/route';
import { createUser } from '@/lib/server/users';
import { signUpSchema } from '@/lib/validations/user';
import { AppError } from '@/lib/http/errors';

export const dynamic = 'force-dynamic';

/** Sign-up: anyone not signed in may create a member account. */
export const POST = route(async ({ req, user }) => {
  if (user) throw new AppError('conflict', 'You are already signed in. Sign out to create another account.');
  const input = signUpSchema.parse(await readJson(req));
  const account = await createUser(input);
  return created({ id: account.id, name: account.name, email: account.email, handle: account.handle });
});
