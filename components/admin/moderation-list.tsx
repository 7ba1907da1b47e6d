'use client';

import Link from 'next/link';
import { useId, useState, useTransition } from 'react';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { ReasonForm } from '@/components/comments/reason-form';
import { IDLE } from '@/components/forms/action-state';
import { hideCommentAction } from '@/lib/actions/comments';
import { dismissReportsAction } from '@/lib/actions/moderation';
import { commentHideSchema, HIDE_REASON_MAX } from '@/lib/validations/comments';
import { formatDateTime, plural } from '@/lib/format';
import type { ModerationItem } from '@/lib/types/moderation';

/** One reported comment: its text, who reported it and why, and the two answers — hide it, or dismiss the reports. */
export function ReportedComment({ item }: { item: ModerationItem }) {
  const headId = useId();
  const [hiding, setHiding] = useState(false);
  const [busy, startBusy] = useTransition();
  const [error, setError] = useState<string | null>(null);

  // Both actions render the queue again on the server: the answered comment leaves it.
  function dismiss() {
    setError(null);
    startBusy(async () => {
      const data = new FormData();
      data.set('commentId', String(item.commentId));
      const state = await dismissReportsAction(IDLE, data);
      if (!state.ok) setError(state.message ?? 'Not dismissed.');
    });
  }

  return (
    <article className="space-y-3 rounded-lg border border-rule bg-card p-4" data-testid={`reported-${item.commentId}`} aria-labelledby={`${headId}-head`}>
      <header id={`${headId}-head`} className="text-sm text-graphite-2">
        <strong className="text-graphite">{item.authorName}</strong> on <Link href={item.href}>{item.where}</Link> · {formatDateTime(item.createdAt)}
      </header>
      <blockquote className="whitespace-pre-line break-words border-l-4 border-rule pl-3">{item.body}</blockquote>
      <div>
        <p className="text-sm font-semibold">Reported {item.reports.length === 1 ? 'once' : plural(item.reports.length, 'time')}</p>
        <ul className="mt-1 space-y-1 text-sm">
          {item.reports.map((r, i) => (
            <li key={i}>
              <span className="font-semibold">{r.reporterName}</span>: <span className="break-words">{r.reason}</span>{' '}
              <span className="text-graphite-2">· {formatDateTime(r.at)}</span>
            </li>
          ))}
        </ul>
      </div>
      {hiding ? (
        <ReasonForm
          name={`Hide the comment by ${item.authorName}`}
          label="Why it is hidden (everyone reading the entry sees this)"
          after="the text is kept; the builder or an admin can show it again."
          max={HIDE_REASON_MAX}
          schema={commentHideSchema}
          action={hideCommentAction}
          fields={{ commentId: item.commentId }}
          submitLabel="Hide the comment"
          busyLabel="Hiding…"
          className="space-y-2"
          onDone={() => setHiding(false)}
          onCancel={() => setHiding(false)}
        />
      ) : (
        <div className="flex flex-wrap gap-2">
          <Button type="button" onClick={() => setHiding(true)}>
            Hide…
          </Button>
          <Button type="button" tone="quiet" disabled={busy} onClick={dismiss}>
            {busy ? 'Dismissing…' : 'Dismiss the reports'}
          </Button>
        </div>
      )}
      {error ? (
        <Notice kind="error" role="alert">
          {error}
        </Notice>
      ) : null}
    </article>
  );
}
