import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { getCurrentUser } from '@/lib/auth/current-user';
import { canOnSite } from '@/lib/auth/policy';
import { searchAccounts } from '@/lib/server/moderation';
import { accountSearchSchema } from '@/lib/validations/moderation';
import { SiteRoleForm } from '@/components/admin/site-role-form';
import { formatDate, plural } from '@/lib/format';
import { inputClass } from '@/components/ui/field';

export const metadata: Metadata = { title: 'Accounts' };

type Props = { searchParams: Promise<{ q?: string | string[]; page?: string | string[] }> };

const first = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);

function pageHref(q: string, page: number) {
  const p = new URLSearchParams();
  if (q) p.set('q', q);
  if (page > 1) p.set('page', String(page));
  const s = p.toString();
  return `/admin/users${s ? `?${s}` : ''}`;
}

export default async function AdminUsersPage({ searchParams }: Props) {
  const user = await getCurrentUser();
  // Not an admin: the page does not exist for them.
  if (!canOnSite(user, 'manageUsers')) notFound();
  const raw = await searchParams;
  // A hand-typed ?page=abc falls back to the first page rather than failing the page.
  const parsed = accountSearchSchema.safeParse({ q: first(raw.q) ?? '', page: first(raw.page) ?? '1' });
  const search = parsed.success ? parsed.data : { q: (first(raw.q) ?? '').slice(0, 100), page: 1 };
  const result = await searchAccounts(user, search);
  const page = Math.min(result.page, result.pages);
  const { accounts, total, pages, q } = page === result.page ? result : await searchAccounts(user, { q: search.q, page });

  return (
    <div className="min-w-0 space-y-4">
      <h1 className="text-2xl font-bold">Accounts</h1>
      <p className="text-graphite-2">Every account is a member. Admins look after the community and can change site roles here.</p>
      <form role="search" action="/admin/users" className="flex flex-wrap items-end gap-2">
        <div className="min-w-0 flex-1 basis-56">
          <label htmlFor="account-search" className="mb-1 block text-sm font-semibold">
            Find an account
          </label>
          <input id="account-search" name="q" type="search" defaultValue={q} placeholder="Name, e-mail or handle" className={inputClass} maxLength={100} />
        </div>
        <button type="submit" className="min-h-11 rounded-md border border-rule bg-card px-4 text-sm font-semibold hover:bg-paper-2">
          Search
        </button>
        {q ? (
          <Link href="/admin/users" className="inline-flex min-h-11 items-center px-2 text-sm">
            Show all
          </Link>
        ) : null}
      </form>
      <p className="text-sm text-graphite-2" role="status" data-testid="accounts-count">
        {q ? `${plural(total, 'account')} match “${q}”` : plural(total, 'account')}
        {pages > 1 ? ` · page ${page} of ${pages}` : ''}
      </p>

      {accounts.length ? (
        // One list for every width: a row of columns on wide screens, a card per account on a phone.
        <ul className="divide-y divide-rule rounded-lg border border-rule bg-card" aria-label="Accounts">
          <li aria-hidden="true" className="hidden bg-paper-2 px-3 py-2 text-sm font-semibold md:grid md:grid-cols-[minmax(0,1.2fr)_minmax(0,1.6fr)_7rem_minmax(0,1.6fr)] md:gap-3">
            <span>Name</span>
            <span>E-mail</span>
            <span>Joined</span>
            <span>Site role</span>
          </li>
          {accounts.map((u) => (
            <li
              key={u.id}
              data-testid={`user-row-${u.email}`}
              className="grid min-w-0 gap-1 p-3 text-sm md:grid-cols-[minmax(0,1.2fr)_minmax(0,1.6fr)_7rem_minmax(0,1.6fr)] md:items-center md:gap-3"
            >
              <span className="min-w-0 break-words font-semibold">{u.name}</span>
              <span className="min-w-0 break-all text-graphite-2 md:text-graphite">{u.email}</span>
              <span className="text-graphite-2 md:text-graphite">
                <span className="md:sr-only">Joined </span>
                {formatDate(u.createdAt)}
              </span>
              <SiteRoleForm userId={u.id} name={u.name} siteRole={u.siteRole} />
            </li>
          ))}
        </ul>
      ) : (
        <p className="rounded-lg border border-dashed border-rule p-6 text-graphite-2">No account matches “{q}”.</p>
      )}

      {pages > 1 ? (
        <nav aria-label="Pages of accounts" className="flex flex-wrap items-center gap-2">
          {page > 1 ? (
            <Link href={pageHref(q, page - 1)} rel="prev" className="inline-flex min-h-11 items-center rounded-md border border-rule bg-card px-3 text-sm font-semibold no-underline">
              ← Newer
            </Link>
          ) : null}
          <span className="text-sm text-graphite-2">
            Page {page} of {pages}
          </span>
          {page < pages ? (
            <Link href={pageHref(q, page + 1)} rel="next" className="inline-flex min-h-11 items-center rounded-md border border-rule bg-card px-3 text-sm font-semibold no-underline">
              Older →
            </Link>
          ) : null}
        </nav>
      ) : null}
    </div>
  );
}
