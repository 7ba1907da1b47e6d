import 'server-only';
import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import { signInSchema } from '../validations/user';
import { SignInRefused, verifyCredentials } from '../server/users';

/** The client's address as the server saw it; behind a proxy, its first forwarded hop. */
export function clientAddress(headers: Record<string, string | string[] | undefined> | Headers | undefined): string {
  const get = (name: string): string | undefined => {
    if (!headers) return undefined;
    if (headers instanceof Headers) return headers.get(name) ?? undefined;
    const v = headers[name];
    return Array.isArray(v) ? v[0] : v;
  };
  return (get('x-forwarded-for')?.split(',')[0] ?? get('x-real-ip') ?? 'local').trim() || 'local';
}

export const authOptions: NextAuthOptions = {
  session: { strategy: 'jwt', maxAge: 30 * 24 * 60 * 60 },
  pages: { signIn: '/sign-in', error: '/sign-in' },
  providers: [
    CredentialsProvider({
      name: 'E-mail and password',
      credentials: { email: { label: 'E-mail', type: 'email' }, password: { label: 'Password', type: 'password' } },
      async authorize(credentials, req) {
        const parsed = signInSchema.safeParse(credentials ?? {});
        if (!parsed.success) throw new Error(parsed.error.issues[0]?.message ?? 'Enter your e-mail and password.');
        try {
          const user = await verifyCredentials(parsed.data.email, parsed.data.password, clientAddress(req?.headers));
          return { id: String(user.id), name: user.name, email: user.email };
        } catch (err) {
          // next-auth passes an Error's message back to the sign-in form.
          if (err instanceof SignInRefused) throw new Error(err.message);
          throw err;
        }
      },
    }),
  ],
  callbacks: {
    async jwt({ token, user }) {
      if (user) token.sub = user.id;
      return token;
    },
    async session({ session, token }) {
      if (session.user && token.sub) (session.user as { id?: string }).id = token.sub;
      return session;
    },
  },
};
