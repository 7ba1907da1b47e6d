import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { getCurrentUser } from '@/lib/auth/current-user';
import { canOnSite } from '@/lib/auth/policy';
import { listModerationQueue } from '@/lib/server/moderation';
import { ReportedComment } from '@/components/admin/moderation-list';
import { formatDateTime, plural } from '@/lib/format';

export const metadata: Metadata = { title: 'Comments to review' };

export default async function AdminCommentsPage() {
  const user = await getCurrentUser();
  if (!canOnSite(user, 'moderateComments')) notFound();
  const { reported, hidden } = await listModerationQueue(user);
  return (
    <div className="min-w-0 space-y-6">
      <h1 className="text-2xl font-bold">Comments to review</h1>
      <section aria-labelledby="reported-heading" className="space-y-3">
        <h2 id="reported-heading" className="text-xl font-bold">
          Reported by members <span className="text-base font-normal text-graphite-2">{plural(reported.length, 'comment')}</span>
        </h2>
        <p className="text-sm text-graphite-2">Oldest report first. Hide a comment that breaks the community’s rules, with a reason readers see; dismiss reports that do not.</p>
        {reported.length ? (
          reported.map((item) => <ReportedComment key={item.commentId} item={item} />)
        ) : (
          <p className="rounded-lg border border-dashed border-rule p-6 text-graphite-2">No reported comments wait for review.</p>
        )}
      </section>
      <section aria-labelledby="hidden-heading" className="space-y-3">
        <h2 id="hidden-heading" className="text-xl font-bold">
          Hidden lately <span className="text-base font-normal text-graphite-2">{plural(hidden.length, 'comment')}</span>
        </h2>
        {hidden.length ? (
          <ul className="space-y-2">
            {hidden.map((c) => (
              <li key={c.commentId} className="rounded-lg border border-rule bg-card p-3 text-sm" data-testid={`hidden-${c.commentId}`}>
                <p>
                  <strong>{c.authorName}</strong> on <Link href={c.href}>{c.where}</Link>
                </p>
                <p className="mt-1 whitespace-pre-line break-words text-graphite-2">{c.body}</p>
                <p className="mt-1">
                  Hidden by {c.hidden!.byName} on {formatDateTime(c.hidden!.at)}: {c.hidden!.reason}
                </p>
              </li>
            ))}
          </ul>
        ) : (
          <p className="rounded-lg border border-dashed border-rule p-6 text-graphite-2">No comment has been hidden.</p>
        )}
      </section>
    </div>
  );
}
