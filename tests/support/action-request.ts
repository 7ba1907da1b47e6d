/**
 * The request a server action sees when a test calls it directly: actions read the session and the Origin
 * through next/headers, which exists only inside a Next request, and revalidate through next/cache.
 * A test file mocks both with these (`vi.mock('next/headers', () => import('../support/action-request').then((m) => m.fakeNextHeaders))`)
 * and says who is acting with `actAs`. Each call comes from its own client address, as many members would:
 * the account mail limits count per client, and they are not what these tests walk.
 */
const current = { cookie: '', origin: '' };

/** The person acting (their session cookie), or nobody; `origin` sends an Origin header (a cross-site try). */
export function actAs(who: { cookie: string } | null, origin = ''): void {
  current.cookie = who?.cookie ?? '';
  current.origin = origin;
}

export const fakeNextHeaders = {
  cookies: async () => {
    const jar = new Map(current.cookie ? current.cookie.split('; ').map((c) => c.split('=', 2) as [string, string]) : []);
    return { get: (name: string) => (jar.has(name) ? { name, value: jar.get(name)! } : undefined), getAll: () => [...jar].map(([name, value]) => ({ name, value })) };
  },
  headers: async () => {
    const h = new Headers({ host: '127.0.0.1:3000', 'x-scribeline-peer': `10.88.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}` });
    if (current.cookie) h.set('cookie', current.cookie);
    if (current.origin) h.set('origin', current.origin);
    return h;
  },
};

export const fakeNextCache = { revalidatePath: () => undefined, revalidateTag: () => undefined };
