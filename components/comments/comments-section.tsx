'use client';

import Link from 'next/link';
import { postCommentAction } from '@/lib/actions/comments';
import { Button, ButtonLink } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { VerifyAddressNotice } from '@/components/auth/verify-address-notice';
import { CommentForm } from './lazy-forms';
import { CommentItem } from './comment-item';
import { useDiscussion, usePlayhead } from './entry-discussion';
import { useSignInHref } from '@/components/ui/sign-in-link';

type Props = {
  /** Where "Sign in to comment" comes back to. */
  entryPath: string;
  /** The entry has a clip, so a comment can be pinned to a moment of it. */
  hasClip: boolean;
  /** The viewer is this entry's builder (changes the wording of "comments are closed"). */
  isBuilder: boolean;
};

/** An entry's comments: the threads, then the form (or why there is none). */
export function CommentsSection({ entryPath, hasClip, isBuilder }: Props) {
  const { entryId, payload, loadError, loading, loadMore, loadingMore, applyChange, refresh, bindAskForm } = useDiscussion();
  const playhead = usePlayhead();

  const count = payload?.count ?? 0;
  // Back to this very page (its ?t= or ?clip= too), at the comments.
  const signIn = useSignInHref(`${entryPath}#comments`);

  return (
    <section id="comments" aria-labelledby="comments-heading" className="scroll-mt-24 space-y-5 border-t-2 border-rule pt-6">
      <h2 id="comments-heading" className="flex flex-wrap items-baseline gap-x-3 text-xl font-bold">
        Comments
        {payload ? <span className="text-base font-normal text-graphite-2">{count === 1 ? '1 comment' : `${count} comments`}</span> : null}
      </h2>

      {loadError ? (
        <div role="alert">
          <Notice kind="error" title="Could not load the comments">
            <p>{loadError.message}</p>
            <Button type="button" tone="quiet" className="mt-2" onClick={refresh} disabled={loading}>
              {loading ? 'Trying again…' : 'Try again'}
            </Button>
          </Notice>
        </div>
      ) : null}

      {!payload ? (
        loadError ? null : (
          <p role="status" className="rounded-md border border-dashed border-rule px-4 py-6 text-center text-sm text-graphite-2">
            Loading the comments…
          </p>
        )
      ) : payload.comments.length ? (
        <ol className="space-y-6" aria-label="Comments, oldest first">
          {payload.comments.map((c) => (
            <li key={c.id} className="rounded-lg border border-rule bg-card p-3 sm:p-4">
              <CommentItem comment={c} />
            </li>
          ))}
        </ol>
      ) : (
        <p className="rounded-md border border-dashed border-rule px-4 py-6 text-center text-sm text-graphite-2">
          No comments yet.{payload.can.comment ? ' Ask about a step, or say what worked in your own shop.' : ''}
        </p>
      )}

      {payload?.nextCursor ? (
        <div className="flex justify-center">
          {/* The next threads, oldest first, after the ones shown; the server pages them. */}
          <Button type="button" tone="quiet" onClick={loadMore} disabled={loadingMore} aria-describedby="comments-heading">
            {loadingMore ? 'Loading more comments…' : 'Show more comments'}
          </Button>
        </div>
      ) : null}

      {payload ? (
        payload.can.comment ? (
          <div className="space-y-2 rounded-lg border border-rule bg-paper-2/50 p-3 sm:p-4 print:hidden">
            <h3 className="text-lg font-semibold">Add a comment</h3>
            <CommentForm
              handle={bindAskForm}
              name="New comment"
              label="Your comment"
              hint={`Plain text; links work. At most ${payload.limits.perMinute} comments a minute and ${payload.limits.perHour} an hour.`}
              submitLabel="Post comment"
              busyLabel="Posting…"
              action={postCommentAction}
              fields={{ entryId }}
              playhead={hasClip ? playhead : null}
              onDone={applyChange}
            />
          </div>
        ) : payload.can.closedReason === 'sign-in' ? (
          <div className="flex flex-wrap items-center gap-3 rounded-lg border border-rule bg-paper-2/50 p-4 print:hidden">
            <p className="text-sm">Members can ask questions and answer each other here.</p>
            <ButtonLink href={signIn}>Sign in to comment</ButtonLink>
            <span className="text-sm text-graphite-2">
              or <Link href="/sign-up">create an account</Link>
            </span>
          </div>
        ) : payload.can.closedReason === 'verify' ? (
          <VerifyAddressNotice />
        ) : payload.can.closedReason === 'not-published' ? (
          <Notice kind="info" title="Comments are closed for now">
            {isBuilder
              ? 'Readers can comment once this session and its project are in the open log.'
              : 'Comments open when the builder puts this session in the open log. Until then it can be read by link only.'}
          </Notice>
        ) : null
      ) : null}
    </section>
  );
}
