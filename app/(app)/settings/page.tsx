import type { Metadata } from 'next';
import { getCurrentUser } from '@/lib/auth/current-user';
import { listMyFollows } from '@/lib/server/follows';
import { FollowSettings } from '@/components/following/follow-settings';

export const dynamic = 'force-dynamic';
export const metadata: Metadata = { title: 'Settings' };

export default async function SettingsPage() {
  const user = await getCurrentUser();
  // listMyFollows asks the policy (manageOwnSettings); the signed-in layout already sent strangers to sign in.
  const follows = await listMyFollows(user);
  return (
    <div className="max-w-3xl space-y-6">
      <div>
        <h1 className="text-2xl font-bold">Settings</h1>
        <p className="text-graphite-2">
          Signed in as <strong className="text-graphite">{user!.name}</strong> <span className="dim text-sm">({user!.email})</span>
        </p>
      </div>
      <section aria-labelledby="follows-heading" className="space-y-3">
        <h2 id="follows-heading" className="text-xl font-bold">
          What you follow
        </h2>
        <p className="text-sm text-graphite-2">
          When a builder publishes a shop session in a project you follow, or any project of a builder you follow, you get one e-mail for it — never one per
          edit. Switch the e-mail off for each follow here, or for all of them at once.
        </p>
        <FollowSettings initial={follows} />
      </section>
    </div>
  );
}
