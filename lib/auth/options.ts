import 'server-only';
import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import { signInSchema } from '../validations/user';
import { endSessions, SignInRefused, verifyCredentials } from '../server/users';
import { safeNextPath } from './safe-redirect';
import { clientAddressFrom } from '../http/client-address';

/** The client's address for the sign-in limits: the socket's peer, stepping back only through TRUSTED_PROXIES. */
export function clientAddress(headers: Record<string, string | string[] | undefined> | Headers | undefined): string {
  const get = (name: string): string | undefined => {
    if (!headers) return undefined;
    if (headers instanceof Headers) return headers.get(name) ?? undefined;
    const v = headers[name];
    return Array.isArray(v) ? v.join(', ') : v;
  };
  return clientAddressFrom(get);
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
          return { id: String(user.id), name: user.name, email: user.email, sessionVersion: user.sessionVersion };
        } catch (err) {
          // next-auth passes an Error's message back to the sign-in form.
          if (err instanceof SignInRefused) throw new Error(err.message);
          throw err;
        }
      },
    }),
  ],
  callbacks: {
    // The cookie names the account and its session version at sign-in (sv); getCurrentUser compares it
    // with the row's on every request. Nothing later (not even next-auth's update) refreshes sv.
    async jwt({ token, user }) {
      if (user) {
        token.sub = user.id;
        token.sv = (user as { sessionVersion?: number }).sessionVersion ?? 0;
      }
      return token;
    },
    async session({ session, token }) {
      if (session.user && token.sub) (session.user as { id?: string }).id = token.sub;
      return session;
    },
    // Where next-auth itself sends the browser after signing in or out: only paths of this site.
    async redirect({ url, baseUrl }) {
      return new URL(safeNextPath(url, '/', baseUrl), baseUrl).toString();
    },
  },
  events: {
    // Signing out ends this session and every copy of its cookie, not just the browser's copy.
    async signOut({ token }) {
      const id = Number(token?.sub);
      if (Number.isInteger(id) && id > 0 && typeof token?.sv === 'number') await endSessions(id, token.sv);
    },
  },
};
