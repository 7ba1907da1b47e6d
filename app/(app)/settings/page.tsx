import type { Metadata } from 'next';
import { getCurrentUser } from '@/lib/auth/current-user';
import { listMyFollows } from '@/lib/server/follows';
import { getAccount } from '@/lib/server/accounts';
import { FollowSettings } from '@/components/following/follow-settings';
import { AccountSettings } from '@/components/auth/account-settings';
import { Notice } from '@/components/ui/notice';
import { ButtonLink } from '@/components/ui/button';
import { AppError } from '@/lib/errors';
import { notFound } from 'next/navigation';

export const metadata: Metadata = { title: 'Settings' };

export default async function SettingsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const user = await getCurrentUser();
  // getAccount and listMyFollows ask the policy (manageOwnSettings); the signed-in layout already sent strangers to sign in.
  const query = await searchParams;
  // One page of follows at a time (`?follows=` the next page's cursor); a page address that cannot be read is the 404 page.
  const after = typeof query.follows === 'string' ? query.follows : null;
  const [account, follows] = await Promise.all([
    getAccount(user),
    listMyFollows(user, after).catch((err: unknown) => {
      if (err instanceof AppError && err.code === 'validation') notFound();
      throw err;
    }),
  ]);
  return (
    <div className="max-w-5xl space-y-8">
      <div>
        <h1 className="text-2xl font-bold">Settings</h1>
        <p className="text-graphite-2">
          Signed in as <strong className="text-graphite">{account.name}</strong> <span className="dim text-sm">({account.email})</span>
        </p>
      </div>
      {query.address === 'changed' ? (
        <Notice kind="success" role="status" title="Address changed">
          Your account now uses {account.email}.
        </Notice>
      ) : null}
      <section aria-labelledby="account-heading" className="space-y-3">
        <h2 id="account-heading" className="text-xl font-bold">
          Your account
        </h2>
        <AccountSettings account={account} />
      </section>
      <section aria-labelledby="follows-heading" className="space-y-3">
        <h2 id="follows-heading" className="text-xl font-bold">
          What you follow
        </h2>
        <p className="text-sm text-graphite-2">
          When a builder publishes a shop session in a project you follow, or any project of a builder you follow, you get one e-mail for it — never one per
          edit. Switch the e-mail off for each follow here, or for all of them at once.
        </p>
        <FollowSettings follows={follows.follows} />
        {after || follows.nextCursor ? (
          <nav aria-label="Pages of your follows" className="flex flex-wrap justify-end gap-2">
            {after ? (
              <ButtonLink href="/settings" tone="quiet">
                Newest follows
              </ButtonLink>
            ) : null}
            {follows.nextCursor ? (
              <ButtonLink href={`/settings?follows=${encodeURIComponent(follows.nextCursor)}`} tone="quiet">
                Older follows
              </ButtonLink>
            ) : null}
          </nav>
        ) : null}
      </section>
    </div>
  );
}
